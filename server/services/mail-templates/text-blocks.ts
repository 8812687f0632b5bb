import type { KeyValueRow } from './layout';

/** Label / value rows for the plain-text part; money reads best right-aligned, words left-aligned. */
export function textKeyValues(rows: KeyValueRow[], align: 'left' | 'right' = 'left'): string[] {
  const labelWidth = Math.max(0, ...rows.map((r) => r.label.length)) + 2;
  const valueWidth = Math.max(0, ...rows.map((r) => r.value.length));
  return rows.map((r) =>
    `${r.label.padEnd(labelWidth)}${align === 'right' ? r.value.padStart(valueWidth) : r.value}`.trimEnd(),
  );
}

export function indent(lines: string[], by = 2): string[] {
  const pad = ' '.repeat(by);
  return lines.map((line) => (line === '' ? line : pad + line));
}

export function textHeading(title: string): string[] {
  return ['', title.toUpperCase(), '-'.repeat(title.length)];
}
