import { escapeHtml } from './escape-html';

export const DISTRIBUTOR_NAME = 'Spoolyard Turbo Supply';
export const DISTRIBUTOR_ADDRESS = 'Unit 7, Foundry Row, Quenchfold';

/** Palette from the design notes; mail clients ignore stylesheets, so these go inline. */
export const MAIL_COLOURS = {
  ink: '#23211e',
  cast: '#5c5852',
  castLine: '#cfcac2',
  paper: '#f8f6f3',
  panel: '#ece8e2',
  temper: '#2e47a3',
  amber: '#b87512',
  amberTint: '#fbf1de',
} as const;

const FONT = "'Source Sans 3', 'Segoe UI', Helvetica, Arial, sans-serif";
const C = MAIL_COLOURS;

/** Markup that is already safe; everything else interpolated into `html` is escaped. */
export class SafeHtml {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

function part(value: unknown): string {
  if (value instanceof SafeHtml) return value.value;
  if (Array.isArray(value)) return value.map(part).join('');
  if (value === null || value === undefined || value === false) return '';
  return escapeHtml(String(value));
}

export function html(strings: TemplateStringsArray, ...values: unknown[]): SafeHtml {
  let out = strings[0] ?? '';
  values.forEach((value, i) => {
    out += part(value) + (strings[i + 1] ?? '');
  });
  return new SafeHtml(out);
}

export function paragraph(content: unknown): SafeHtml {
  return html`<p style="margin:0 0 16px 0;">${content}</p>`;
}

export function heading(content: unknown): SafeHtml {
  return html`<h1 style="margin:0 0 16px 0;font-family:${FONT};font-size:22px;line-height:1.3;font-weight:700;color:${C.ink};">${content}</h1>`;
}

export function subheading(content: unknown): SafeHtml {
  return html`<h2 style="margin:24px 0 8px 0;font-family:${FONT};font-size:18px;line-height:1.3;font-weight:700;color:${C.ink};">${content}</h2>`;
}

export function link(href: string, label: unknown): SafeHtml {
  return html`<a href="${href}" style="color:${C.temper};text-decoration:underline;">${label}</a>`;
}

/** A bulletproof button: a coloured table cell, so it survives clients that drop padding on links. */
export function button(href: string, label: string): SafeHtml {
  return html`<table role="presentation" cellpadding="0" cellspacing="0" border="0" style="margin:8px 0 20px 0;"><tr><td style="background:${C.temper};border-radius:4px;"><a href="${href}" style="display:inline-block;padding:12px 20px;font-family:${FONT};font-size:16px;font-weight:700;color:#ffffff;text-decoration:none;">${label}</a></td></tr></table>`;
}

/**
 * Amber caution block. The text itself stays ink: amber on its tint is below 4.5:1, so amber carries the
 * border and the word "Caution" with its sign carries the meaning.
 */
export function caution(title: string, content: unknown): SafeHtml {
  return html`<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="margin:16px 0;"><tr><td style="background:${C.amberTint};border-left:4px solid ${C.amber};padding:12px 16px;color:${C.ink};font-family:${FONT};font-size:15px;line-height:1.5;"><strong>&#9888; ${title}</strong><br>${content}</td></tr></table>`;
}

/** A bordered label for states such as back-order: a word and a shape, never colour alone. */
export function tag(label: string): SafeHtml {
  return html`<span style="display:inline-block;padding:1px 6px;border:1px solid ${C.amber};background:${C.amberTint};color:${C.ink};font-size:13px;font-weight:700;letter-spacing:0.02em;">&#9684; ${label}</span>`;
}

export interface KeyValueRow {
  label: string;
  value: string;
  strong?: boolean;
}

/** Label / value rows with the values right-aligned, as for totals or account terms. */
export function keyValueTable(rows: KeyValueRow[]): SafeHtml {
  return html`<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="margin:0 0 16px 0;font-family:${FONT};font-size:15px;color:${C.ink};">${rows.map(
    (row) =>
      html`<tr><td style="padding:4px 0;${row.strong ? `border-top:1px solid ${C.castLine};font-weight:700;` : ''}">${row.label}</td><td align="right" style="padding:4px 0;text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap;${row.strong ? `border-top:1px solid ${C.castLine};font-weight:700;` : ''}">${row.value}</td></tr>`,
  )}</table>`;
}

export interface TableColumn {
  header: string;
  align?: 'left' | 'right';
}

/** A data table with a header row; cells are escaped unless built with `html`. */
export function dataTable(columns: TableColumn[], rows: unknown[][]): SafeHtml {
  const th = columns.map(
    (c) =>
      html`<th align="${c.align ?? 'left'}" style="padding:6px 8px 6px 0;border-bottom:2px solid ${C.ink};text-align:${c.align ?? 'left'};${c.align === 'right' ? 'white-space:nowrap;' : ''}font-size:13px;font-weight:700;color:${C.cast};">${c.header}</th>`,
  );
  const tr = rows.map(
    (row) =>
      html`<tr>${row.map((cell, i) => {
        const align = columns[i]?.align ?? 'left';
        const numeric = align === 'right' ? 'font-variant-numeric:tabular-nums;white-space:nowrap;' : '';
        return html`<td align="${align}" valign="top" style="padding:8px 8px 8px 0;border-bottom:1px solid ${C.castLine};text-align:${align};${numeric}">${cell}</td>`;
      })}</tr>`,
  );
  return html`<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="margin:0 0 16px 0;border-collapse:collapse;font-family:${FONT};font-size:15px;line-height:1.4;color:${C.ink};"><thead><tr>${th}</tr></thead><tbody>${tr}</tbody></table>`;
}

/** Part numbers are set heavier and never wrapped. */
export function partNumber(value: string): SafeHtml {
  return html`<span style="font-weight:700;white-space:nowrap;font-variant-numeric:tabular-nums;">${value}</span>`;
}

export function addressBlock(lines: string[]): SafeHtml {
  return html`<p style="margin:0 0 16px 0;">${lines.map((line, i) => html`${i > 0 ? new SafeHtml('<br>') : ''}${line}`)}</p>`;
}

export interface LayoutInput {
  /** Used as the document title; usually the subject. */
  title: string;
  /** The one-line summary many inboxes show beside the subject. */
  preheader: string;
  body: SafeHtml;
  /** Why the reader got this message, shown small in the footer. */
  footerNote?: string;
}

/** The shared HTML frame: table-based and inline-styled so it renders the same in old and new mail clients. */
export function renderLayout(input: LayoutInput): string {
  const page = html`<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="color-scheme" content="light">
<title>${input.title}</title>
</head>
<body style="margin:0;padding:0;background:${C.panel};">
<div style="display:none;max-height:0;overflow:hidden;opacity:0;">${input.preheader}</div>
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="background:${C.panel};">
<tr><td align="center" style="padding:24px 12px;">
<table role="presentation" width="600" cellpadding="0" cellspacing="0" border="0" style="width:100%;max-width:600px;background:${C.paper};border:1px solid ${C.castLine};">
<tr><td style="background:${C.ink};padding:16px 24px;font-family:${FONT};font-size:18px;font-weight:700;color:${C.paper};">${DISTRIBUTOR_NAME}</td></tr>
<tr><td style="padding:24px;font-family:${FONT};font-size:16px;line-height:1.5;color:${C.ink};">${input.body}</td></tr>
<tr><td style="padding:16px 24px;border-top:1px solid ${C.castLine};font-family:${FONT};font-size:13px;line-height:1.5;color:${C.cast};">${DISTRIBUTOR_NAME} &middot; ${DISTRIBUTOR_ADDRESS}${input.footerNote ? html`<br>${input.footerNote}` : ''}</td></tr>
</table>
</td></tr>
</table>
</body>
</html>`;
  return page.value;
}

/** The plain-text frame: the same sign-off as the HTML, so the text part reads complete on its own. */
export function renderTextLayout(body: string[], footerNote?: string): string {
  const footer = ['--', `${DISTRIBUTOR_NAME}`, DISTRIBUTOR_ADDRESS];
  if (footerNote) footer.push(footerNote);
  return `${[...body, '', ...footer].join('\n').replace(/\n{3,}/g, '\n\n')}\n`;
}
