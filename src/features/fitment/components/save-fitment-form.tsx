import { zodResolver } from '@hookform/resolvers/zod';
import { Bookmark, CircleCheck } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { FitmentRequest } from '../../../../shared/schemas/fitment';
import { SAVED_FITMENT_NAME_MAX, SaveFitmentSchema, type SavedFitment } from '../../../../shared/schemas/saved-fitments';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useSaveFitment } from '../api/save-fitment';

const NameSchema = SaveFitmentSchema.pick({ name: true });

/** Keep a check under a name; signed-out buyers are asked to sign in first. */
export function SaveFitmentForm({ request, signedIn, saved, onSaved }: {
  request: FitmentRequest;
  signedIn: boolean;
  saved: Pick<SavedFitment, 'id' | 'name'> | null;
  onSaved: (saved: SavedFitment) => void;
}) {
  const save = useSaveFitment();
  const { register, handleSubmit, formState } = useForm<{ name: string }>({ resolver: zodResolver(NameSchema), defaultValues: { name: '' } });

  if (!signedIn) {
    return (
      <p className="flex items-center gap-2">
        <Bookmark aria-hidden className="size-4 text-cast" />
        <span>
          <Link to="/sign-in" className="font-semibold text-temper underline underline-offset-2">
            Sign in to save
          </Link>{' '}
          this check and attach it to the parts you order.
        </span>
      </p>
    );
  }
  if (saved) {
    return (
      <p role="status" className="flex items-center gap-2">
        <CircleCheck aria-hidden className="size-5 text-machined" />
        <span>
          Saved as <span className="font-semibold">“{saved.name}”</span>. Parts you add to the cart from here carry this check.{' '}
          <Link to="/fitment/saved" className="font-semibold text-temper underline underline-offset-2">
            Your saved checks
          </Link>
        </span>
      </p>
    );
  }
  const error = formState.errors.name?.message ?? (save.error instanceof ApiError ? (save.error.fieldErrors.name?.[0] ?? save.error.message) : undefined);
  return (
    <form
      noValidate
      onSubmit={handleSubmit(({ name }) => save.mutate({ name, input: request }, { onSuccess: onSaved }))}
      className="grid gap-1"
      aria-label="Save this check"
    >
      <label htmlFor="save-fitment-name" className="font-semibold">
        Save this check as
      </label>
      <div className="flex flex-wrap gap-2">
        <input
          id="save-fitment-name"
          {...register('name')}
          maxLength={SAVED_FITMENT_NAME_MAX}
          placeholder="customer’s 2.0 L street car"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? 'save-fitment-error' : 'save-fitment-hint'}
          className={`min-h-11 min-w-0 flex-1 rounded-md border bg-white px-3 placeholder:text-cast ${error ? 'border-oxide ring-1 ring-oxide' : 'border-cast-line focus:border-temper'}`}
        />
        <Button type="submit" variant="secondary" disabled={save.isPending}>
          <Bookmark aria-hidden className="size-4" />
          {save.isPending ? 'Saving…' : 'Save check'}
        </Button>
      </div>
      {error ? (
        <p id="save-fitment-error" className="text-sm font-semibold text-oxide">
          {error.charAt(0).toUpperCase() + error.slice(1)}
        </p>
      ) : (
        <p id="save-fitment-hint" className="text-sm text-cast">
          A name you will recognise later. Saved checks can be attached to cart lines.
        </p>
      )}
    </form>
  );
}
