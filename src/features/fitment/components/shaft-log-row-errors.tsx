import { AlertOctagon } from 'lucide-react';
import { forwardRef } from 'react';
import type { ShaftLogRowError } from '../../../../shared/schemas/shaft-logs';

export interface RowErrorsProps {
  title: string;
  errors: readonly ShaftLogRowError[];
  /** Problems found but not listed, when the file is badly off. */
  more: number;
}

export const rowErrorsTitle = (count: number) => `The file was not uploaded: ${count} ${count === 1 ? 'problem' : 'problems'} to fix`;

/** The problems in a log file, each with the line and column it is on, as a text editor or spreadsheet numbers them. */
export const ShaftLogRowErrors = forwardRef<HTMLDivElement, RowErrorsProps>(function ShaftLogRowErrors({ title, errors, more }, ref) {
  const whole = errors.filter((e) => e.line === null);
  const located = errors.filter((e) => e.line !== null);
  return (
    <div ref={ref} tabIndex={-1} role="alert" aria-labelledby="log-errors-title" className="grid gap-3 rounded-md border-2 border-oxide bg-oxide-tint p-4 outline-none">
      <p id="log-errors-title" className="flex items-center gap-2 font-semibold text-oxide">
        <AlertOctagon aria-hidden className="size-5 shrink-0" />
        {title}
      </p>
      {whole.length > 0 && (
        <ul className="list-disc pl-6">
          {whole.map((e) => (
            <li key={e.message}>{e.message}</li>
          ))}
        </ul>
      )}
      {located.length > 0 && (
        <div className="max-h-80 overflow-auto rounded bg-white ring-1 ring-cast-line">
          <table className="w-full border-collapse text-left text-sm">
            <caption className="sr-only">Problems in the file, by line</caption>
            <thead>
              <tr className="border-b-2 border-ink">
                <th scope="col" className="sticky top-0 bg-white px-3 py-1.5 text-right font-semibold">
                  Line
                </th>
                <th scope="col" className="sticky top-0 bg-white px-3 py-1.5 font-semibold">
                  Column
                </th>
                <th scope="col" className="sticky top-0 bg-white px-3 py-1.5 font-semibold">
                  Problem
                </th>
              </tr>
            </thead>
            <tbody>
              {located.map((e, i) => (
                <tr key={`${e.line}-${e.column}-${i}`} className="border-b border-cast-line/60 align-top">
                  <td className="tabular px-3 py-1.5 text-right font-semibold">{e.line}</td>
                  <td className="px-3 py-1.5 font-mono text-xs">{e.column ?? 'whole line'}</td>
                  <td className="px-3 py-1.5">{e.message}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {more > 0 && (
        <p className="text-sm">
          The first {errors.length} are listed; {more} more are further down the file.
        </p>
      )}
    </div>
  );
});
