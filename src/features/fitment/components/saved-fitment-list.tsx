import { ChartLine, FolderOpen, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { SavedFitment } from '../../../../shared/schemas/saved-fitments';
import { formatDate } from '../../../../shared/format';
import { Button, buttonClass } from '../../../components/ui/button';
import { useDeleteSavedFitment } from '../api/delete-saved-fitment';


function SavedRow({ item }: { item: SavedFitment }) {
  const remove = useDeleteSavedFitment();
  const [confirming, setConfirming] = useState(false);
  return (
    <li className="flex flex-wrap items-center gap-x-4 gap-y-2 p-4" aria-labelledby={`saved-${item.id}`}>
      <div className="min-w-0 flex-1 basis-72">
        <h2 id={`saved-${item.id}`} className="text-lg font-bold">
          {item.name}
        </h2>
        <p>{item.summary}</p>
        <p className="text-sm text-cast">
          Saved <time dateTime={item.createdAt}>{formatDate(item.createdAt)}</time>
        </p>
      </div>
      {confirming ? (
        <div role="group" aria-label={`Delete ${item.name}?`} className="flex flex-wrap items-center gap-2">
          <span className="font-semibold">Delete this check?</span>
          <Button
            variant="primary"
            className="bg-oxide hover:bg-oxide/90"
            disabled={remove.isPending}
            onClick={() => remove.mutate(item.id)}
          >
            {remove.isPending ? 'Deleting…' : 'Yes, delete'}
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Link to={`/fitment?saved=${item.id}`} className={buttonClass('primary')}>
            <FolderOpen aria-hidden className="size-4" />
            Open<span className="sr-only"> {item.name}</span>
          </Link>
          <Link to={`/fitment/saved/${item.id}/logs`} className={buttonClass('secondary')}>
            <ChartLine aria-hidden className="size-4" />
            Shaft-speed logs<span className="sr-only"> of {item.name}</span>
          </Link>
          <Button variant="secondary" onClick={() => setConfirming(true)}>
            <Trash2 aria-hidden className="size-4" />
            Delete<span className="sr-only"> {item.name}</span>
          </Button>
        </div>
      )}
      {remove.isError && (
        <p role="alert" className="basis-full font-semibold text-oxide">
          {remove.error.message}
        </p>
      )}
    </li>
  );
}

export function SavedFitmentList({ items }: { items: SavedFitment[] }) {
  return (
    <ul className="divide-y divide-cast-line rounded-lg bg-white ring-1 ring-cast-line">
      {items.map((item) => (
        <SavedRow key={item.id} item={item} />
      ))}
    </ul>
  );
}
