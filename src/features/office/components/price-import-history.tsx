import { AlertTriangle, CircleCheck, Clock } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../../shared/format';
import { Td, TableFrame, Th } from '../../../components/ui/table';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { usePriceImportHistory } from '../api/get-price-import-history';
import { Pager } from './pager';

/** Every price list uploaded: who, when, which file, what it changed; each opens on its diff. */
export function PriceImportHistoryList({ page, onPage }: { page: number; onPage: (page: number) => void }) {
  const history = usePriceImportHistory(page);
  return (
    <section aria-labelledby="import-history-heading" className="grid gap-3">
      <h2 id="import-history-heading" className="text-xl font-bold">
        Import history
      </h2>
      {history.isPending ? (
        <LoadingState label="Loading the import history…" />
      ) : history.isError ? (
        <ErrorState title="The import history did not load" message={history.error.message} onRetry={() => history.refetch()} />
      ) : history.data.total === 0 ? (
        <EmptyState title="No price lists imported yet">
          <p>Each upload is listed here with who applied it and what it changed.</p>
        </EmptyState>
      ) : (
        <>
          <TableFrame>
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Price lists uploaded, newest first</caption>
              <thead className="bg-panel">
                <tr>
                  <Th>File</Th>
                  <Th>Uploaded</Th>
                  <Th>Applied</Th>
                  <Th numeric>Rows</Th>
                  <Th numeric>Changed</Th>
                  <Th numeric>New</Th>
                  <Th numeric>Flagged</Th>
                  <Th>
                    <span className="sr-only">Actions</span>
                  </Th>
                </tr>
              </thead>
              <tbody>
                {history.data.items.map((i) => (
                  <tr key={i.id} className="border-b border-cast-line align-top">
                    <Td>
                      <span className="font-mono font-semibold">{i.fileName}</span>
                    </Td>
                    <Td>
                      {i.createdBy}
                      <span className="block text-sm text-cast">{formatDateTime(i.createdAt)}</span>
                    </Td>
                    <Td>
                      {i.status === 'applied' ? (
                        <>
                          <span className="inline-flex items-center gap-1 font-semibold text-machined">
                            <CircleCheck aria-hidden className="size-4" /> {i.appliedBy ?? '—'}
                          </span>
                          <span className="block text-sm text-cast">{i.appliedAt ? formatDateTime(i.appliedAt) : ''}</span>
                        </>
                      ) : (
                        <span className="inline-flex items-center gap-1 text-cast">
                          <Clock aria-hidden className="size-4" /> Not applied
                        </span>
                      )}
                    </Td>
                    <Td numeric>{i.totalRows.toLocaleString('en-US')}</Td>
                    <Td numeric>{i.status === 'applied' ? i.changedCount.toLocaleString('en-US') : '—'}</Td>
                    <Td numeric>{i.status === 'applied' ? i.newCount.toLocaleString('en-US') : '—'}</Td>
                    <Td numeric>
                      {i.status === 'applied' && i.flaggedCount > 0 ? (
                        <span className="inline-flex items-center gap-1 text-amber">
                          <AlertTriangle aria-hidden className="size-4" />
                          {i.flaggedCount.toLocaleString('en-US')}
                        </span>
                      ) : i.status === 'applied' ? (
                        '0'
                      ) : (
                        '—'
                      )}
                    </Td>
                    <Td className="whitespace-nowrap text-right">
                      <Link to={`/office/price-imports?import=${i.id}`} className="font-semibold text-temper underline underline-offset-2">
                        {i.status === 'applied' ? 'View changes' : 'Open preview'}
                        <span className="sr-only"> of {i.fileName}</span>
                      </Link>
                    </Td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
          <Pager page={page} pageSize={history.data.pageSize} total={history.data.total} noun={['import', 'imports']} onPage={onPage} />
        </>
      )}
    </section>
  );
}
