import { zodResolver } from '@hookform/resolvers/zod';
import { Ban, CircleCheckBig, CreditCard, Landmark, Undo2 } from 'lucide-react';
import { useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { formatPrice } from '../../../../shared/catalog';
import {
  CONDITION_GRADE_KEYS,
  CONDITION_GRADES,
  DECISIONS_FOR_KIND,
  normalizeReturnReference,
  RETURN_KINDS,
  ReturnDecisionSchema,
  type ReturnDecision,
  type ReturnDecisionKey,
  type ReturnKind,
  type ReturnView,
} from '../../../../shared/schemas/warehouse';
import { Notice } from '../../../components/ui/notice';
import { PageNav } from '../../../components/ui/page-nav';
import { ApiError } from '../../../lib/api-client';
import { ScanField } from './scan-field';
import { resolveScan } from '../api/resolve-scan';
import { Button } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useDecideReturn } from '../api/decide-return';
import { useReturnByCode, useReturns, type ReturnFilter } from '../api/get-returns';
import { formatDateTime } from '../../../../shared/format';
import { centsToDollarsInput, dollarsToCents } from '../lib/money';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, FieldShell, SelectField, TextAreaField, TextField } from '../../../components/ui/form';


/** The returns desk: scan a label (or pick from the list), grade what came back and settle it. */
export function ReturnsPage({
  status,
  page,
  openRef,
  onStatus,
  onPage,
  onOpen,
}: {
  status: ReturnFilter;
  page: number;
  openRef: string | null;
  onStatus: (s: ReturnFilter) => void;
  onPage: (p: number) => void;
  onOpen: (reference: string | null) => void;
}) {
  const list = useReturns(status, page);
  const open = useReturnByCode(openRef);
  const [scan, setScan] = useState('');
  const [scanError, setScanError] = useState<string | undefined>(undefined);
  const scanRef = useRef<HTMLInputElement>(null);
  const submitScan = (e: React.FormEvent) => {
    e.preventDefault();
    const reference = normalizeReturnReference(scan);
    const typed = scan.trim();
    if (!reference) {
      if (!typed) {
        setScanError('Scan the code on the return label.');
        return;
      }
      // Not a return number: the Floor's resolver says what it is (a part's or a bin's label, a misread GTIN).
      resolveScan(typed, ['return']).then(
        (found) => {
          if (found.kind !== 'return') return;
          setScanError(undefined);
          setScan('');
          onOpen(found.return.reference);
        },
        (err: unknown) =>
          setScanError(err instanceof ApiError && !err.isNotFound ? err.message : `${typed} is not a return label: those read like RT-5001.`),
      );
      return;
    }
    setScanError(undefined);
    setScan('');
    onOpen(reference);
  };
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <form noValidate onSubmit={submitScan} aria-label="Find a return by its label" className="grid gap-3 rounded-lg border-2 border-cast-line bg-white p-4">
        <ScanField
          ref={scanRef}
          id="ret-scan"
          label="Return label"
          value={scan}
          onChange={(e) => setScan(e.target.value)}
          hold={open.data?.status === 'requested'}
          error={scanError}
          hint="Scan the barcode on the parcel's return label (or type the RT number); Enter opens it."
        />
      </form>

      {openRef && open.isPending && <LoadingState label={`Looking up ${openRef}…`} />}
      {openRef && open.isError && (
        <ErrorState
          title={open.error instanceof ApiError && open.error.isNotFound ? `No return ${openRef}` : `${openRef} did not load`}
          message={open.error instanceof ApiError && open.error.isNotFound ? 'Check the label: the number may be from another parcel.' : open.error.message}
        />
      )}
      {open.data && <ReturnDetail key={open.data.id} ret={open.data} onClose={() => onOpen(null)} />}

      <fieldset className="flex flex-wrap gap-2">
        <legend className="sr-only">Which returns</legend>
        {(['requested', 'all'] as const).map((s) => (
          <label
            key={s}
            className={`inline-flex min-h-12 cursor-pointer items-center gap-2 rounded-md border-2 px-4 text-lg font-semibold has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-temper ${
              status === s ? 'border-temper bg-temper-tint text-temper-deep' : 'border-cast-line bg-white'
            }`}
          >
            <input type="radio" name="returns-status" value={s} checked={status === s} onChange={() => onStatus(s)} className="size-5 accent-temper" />
            {s === 'requested' ? 'Waiting to be received' : 'All returns'}
          </label>
        ))}
      </fieldset>

      {list.isPending ? (
        <LoadingState label="Loading returns…" />
      ) : list.error ? (
        <ErrorState title="Returns did not load" message={list.error.message} onRetry={() => void list.refetch()} />
      ) : list.data.items.length === 0 ? (
        <EmptyState title={status === 'requested' ? 'No returns waiting' : 'No returns yet'}>Returns and exchange cores that customers send back appear here.</EmptyState>
      ) : (
        <>
          <TableFrame>
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">{status === 'requested' ? 'Returns waiting to be received, oldest first' : 'All returns: waiting first, then decided, newest first'}</caption>
              <thead className="bg-panel">
                <tr>
                  <Th density="floor">Return</Th>
                  <Th density="floor">Asked</Th>
                  <Th density="floor">Customer</Th>
                  <Th density="floor">Part</Th>
                  <Th density="floor">Why</Th>
                  <Th numeric density="floor">Qty</Th>
                  <Th density="floor">Status</Th>
                  <Th density="floor">
                    <span className="sr-only">Actions</span>
                  </Th>
                </tr>
              </thead>
              <tbody>
                {list.data.items.map((r) => (
                  <tr key={r.id} className={`border-t border-cast-line first:border-t-0 ${r.reference === openRef ? 'bg-temper-tint/60' : ''}`}>
                    <Td density="floor" className="part-no">
                      {r.reference}
                    </Td>
                    <Td density="floor" className="whitespace-nowrap">
                      {formatDateTime(r.createdAt)}
                    </Td>
                    <Td density="floor">
                      {r.customer}
                      <span className="block text-sm text-cast">
                        order <span className="part-no">{r.orderNumber}</span>
                      </span>
                    </Td>
                    <Td density="floor">
                      <span className="part-no">{r.partNumber}</span>
                      <span className="block max-w-64 truncate text-sm text-cast">{r.title}</span>
                    </Td>
                    <Td density="floor">{RETURN_KINDS[r.kind]}</Td>
                    <Td numeric density="floor">
                      {r.quantity}
                    </Td>
                    <Td density="floor">
                      <StatusBadge kind="return" status={r.status} />
                    </Td>
                    <Td density="floor" className="text-right">
                      <Button variant="secondary" className="min-h-12" onClick={() => onOpen(r.reference)} aria-label={`Open ${r.reference}`}>
                        {r.status === 'requested' ? 'Receive' : 'View'}
                      </Button>
                    </Td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
          <PageNav label="Pages of returns" size="lg" page={list.data.page} pageSize={list.data.pageSize} total={list.data.total} onPage={onPage} />
        </>
      )}
    </div>
  );
}

/** The words for each decision, in the terms of the kind of return: a core's choices are all about its deposit. */
const DECISION_WORDS: Record<'core' | 'part', Partial<Record<ReturnDecisionKey, string>>> = {
  core: { 'core-refund': 'Refund the deposit', 'partial-refund': 'Refund part of the deposit', reject: 'Reject the core' },
  part: { 'full-refund': 'Full refund', 'partial-refund': 'Partial refund', reject: 'Reject' },
};
const wordsFor = (kind: ReturnKind) => DECISION_WORDS[kind === 'core' ? 'core' : 'part'];

/** The form's own shape (the amount is typed in dollars); it becomes a ReturnDecision on submit. */
const decisionForm = (maxCents: number) =>
  z
    .object({
      // Checked in the refinement below, so every field's message shows at once (zod skips refinements on a failed shape).
      conditionGrade: z.string(),
      decision: z.string(),
      restock: z.boolean(),
      amount: z.string(),
      reason: z.string(),
      rejectReason: z.string(),
    })
    .superRefine((v, ctx) => {
      if (!(CONDITION_GRADE_KEYS as readonly string[]).includes(v.conditionGrade)) ctx.addIssue({ code: 'custom', path: ['conditionGrade'], message: 'grade the condition' });
      if (!(v.decision in DECISION_WORDS.core || v.decision in DECISION_WORDS.part)) ctx.addIssue({ code: 'custom', path: ['decision'], message: 'choose a decision' });
      if (v.decision === 'partial-refund') {
        const cents = dollarsToCents(v.amount);
        if (cents === null || cents <= 0) ctx.addIssue({ code: 'custom', path: ['amount'], message: 'enter an amount in dollars, like 45.50' });
        else if (cents > maxCents) ctx.addIssue({ code: 'custom', path: ['amount'], message: `at most ${formatPrice(maxCents)} can be refunded` });
        if (v.reason.trim().length < 3) ctx.addIssue({ code: 'custom', path: ['reason'], message: 'say why it is less than the most' });
      }
      if (v.decision === 'reject' && v.rejectReason.trim().length < 3) ctx.addIssue({ code: 'custom', path: ['rejectReason'], message: 'give a reason' });
    });
type DecisionForm = z.infer<ReturnType<typeof decisionForm>>;

/** The form's values as the API's decision; the shared schema has the last word. */
export function toDecision(v: DecisionForm): ReturnDecision {
  const base = { conditionGrade: v.conditionGrade };
  switch (v.decision) {
    case 'core-refund':
      return ReturnDecisionSchema.parse({ ...base, decision: 'core-refund' });
    case 'full-refund':
      return ReturnDecisionSchema.parse({ ...base, decision: 'full-refund', restock: v.restock });
    case 'partial-refund':
      return ReturnDecisionSchema.parse({ ...base, decision: 'partial-refund', amountCents: dollarsToCents(v.amount) ?? 0, reason: v.reason.trim(), restock: v.restock });
    default:
      return ReturnDecisionSchema.parse({ ...base, decision: 'reject', rejectReason: v.rejectReason.trim() });
  }
}

const FIELDS = [
  { name: 'conditionGrade', id: 'ret-grade', label: 'Condition' },
  { name: 'decision', id: 'ret-decision', label: 'Decision' },
  { name: 'amount', id: 'ret-amount', label: 'Refund amount' },
  { name: 'reason', id: 'ret-reason', label: 'Why less' },
  { name: 'rejectReason', id: 'ret-reject', label: 'Reason for rejecting' },
] as const;

function ReturnDetail({ ret, onClose }: { ret: ReturnView; onClose: () => void }) {
  const [decided, setDecided] = useState<ReturnView | null>(ret.status === 'requested' ? null : ret);
  const decide = setDecided;
  return (
    <section aria-labelledby="ret-heading" className="grid gap-5 rounded-lg border-4 border-temper bg-white p-5">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id="ret-heading" className="text-2xl font-bold">
            Return <span className="part-no">{ret.reference}</span>
          </h2>
          <p className="text-lg text-cast">
            {ret.customer} · order <span className="part-no">{ret.orderNumber}</span> · asked {formatDateTime(ret.createdAt)}
          </p>
        </div>
        <Button variant="quiet" size="lg" onClick={onClose}>
          <Undo2 aria-hidden className="size-5" />
          Close
        </Button>
      </div>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold text-cast">What</dt>
        <dd>
          <span className="tabular font-semibold">{ret.quantity} ×</span> <span className="part-no text-xl">{ret.partNumber}</span> {ret.title}
        </dd>
        <dt className="font-semibold text-cast">Why</dt>
        <dd>
          <span className="font-semibold">{RETURN_KINDS[ret.kind]}</span> — “{ret.reason}”
        </dd>
        <dt className="font-semibold text-cast">Paid by</dt>
        <dd className="inline-flex items-center gap-1.5">
          {ret.paymentMethod === 'card' ? <CreditCard aria-hidden className="size-5 text-cast" /> : <Landmark aria-hidden className="size-5 text-cast" />}
          {ret.paymentMethod === 'card' ? 'Card: a refund goes back to the card' : 'On account: a refund is a credit note'}
        </dd>
        {ret.kind === 'core' ? (
          <>
            <dt className="font-semibold text-cast">Deposit to settle</dt>
            <dd className="tabular text-lg font-semibold">{formatPrice(ret.coreDepositCents)}</dd>
          </>
        ) : (
          <>
            <dt className="font-semibold text-cast">Refund at most</dt>
            <dd className="tabular text-lg font-semibold">{formatPrice(ret.maxRefundCents)}</dd>
            <dt className="font-semibold text-cast">Core deposit</dt>
            <dd className="tabular">{ret.coreDepositCents > 0 ? `${formatPrice(ret.coreDepositCents)} (part of the refund)` : 'none on this line'}</dd>
          </>
        )}
      </dl>
      <Photos ret={ret} />
      {decided ? <Decided ret={decided} /> : <DecisionFormView ret={ret} onDecided={decide} />}
    </section>
  );
}

function Photos({ ret }: { ret: ReturnView }) {
  if (ret.photos.length === 0) return <p className="text-cast">No photos were sent.</p>;
  return (
    <ul aria-label="Photos from the customer" className="flex flex-wrap gap-3">
      {ret.photos.map((name, i) => {
        const src = `/api/returns/photos/${encodeURIComponent(name)}`;
        return (
          <li key={name}>
            <a href={src} target="_blank" rel="noreferrer" className="block rounded-md border border-cast-line bg-panel p-1 hover:border-temper">
              <img src={src} alt={`Photo ${i + 1} of ${ret.photos.length} sent with ${ret.reference}`} className="h-40 w-auto max-w-64 object-contain" loading="lazy" />
              <span className="sr-only"> (opens full size in a new tab)</span>
            </a>
          </li>
        );
      })}
    </ul>
  );
}

function DecisionFormView({ ret, onDecided }: { ret: ReturnView; onDecided: (r: ReturnView) => void }) {
  const decide = useDecideReturn();
  const core = ret.kind === 'core';
  const words = wordsFor(ret.kind);
  const offered = DECISIONS_FOR_KIND[ret.kind].filter((d) => d !== 'core-refund' || ret.coreDepositCents > 0);
  const form = useForm<DecisionForm>({
    resolver: zodResolver(decisionForm(ret.maxRefundCents)),
    defaultValues: { conditionGrade: '', decision: offered[0] ?? '', restock: false, amount: '', reason: '', rejectReason: '' },
  });
  const decision = useWatch({ control: form.control, name: 'decision' });
  const grade = useWatch({ control: form.control, name: 'conditionGrade' });
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit((values) => {
    decide.mutate(
      { id: ret.id, decision: toDecision(values) },
      {
        onSuccess: onDecided,
        onError: (err) => {
          summary.showServerError(err);
        },
      },
    );
  });

  const amountFor = (d: ReturnDecisionKey) =>
    d === 'core-refund' ? formatPrice(Math.min(ret.coreDepositCents, ret.maxRefundCents)) : d === 'full-refund' ? formatPrice(ret.maxRefundCents) : null;

  return (
    <form noValidate onSubmit={onSubmit} aria-labelledby="ret-decide-heading" className="grid gap-5 border-t border-cast-line pt-5">
      <h3 id="ret-decide-heading" className="text-xl font-bold">
        {core ? 'Grade the core and settle its deposit' : 'Grade and decide'}
      </h3>
      {core && (
        <Notice tone="info" size="floor" live="off">
          The customer keeps the exchange unit they bought: a core settles only its deposit of <span className="tabular font-semibold">{formatPrice(ret.coreDepositCents)}</span>. A core goes to
          the rebuild bench, not back on the shelf.
        </Notice>
      )}
      {summary.shown && <ErrorSummary variant="floor" {...summary.props} />}
      <SelectField variant="floor" id="ret-grade" label="Condition" error={errors.conditionGrade?.message} {...form.register('conditionGrade')}>
        <option value="" disabled>
          Grade what came back
        </option>
        {CONDITION_GRADE_KEYS.map((g) => (
          <option key={g} value={g}>
            {CONDITION_GRADES[g]}
          </option>
        ))}
      </SelectField>
      <fieldset className="grid gap-2" aria-describedby={errors.decision ? 'ret-decision-error' : undefined}>
        <legend className="text-lg font-semibold">Decision</legend>
        {offered.map((d, i) => (
          <label key={d} className="flex min-h-12 cursor-pointer items-center gap-3 rounded-md border-2 border-cast-line px-3 has-[:checked]:border-temper has-[:checked]:bg-temper-tint/60">
            <input id={i === 0 ? 'ret-decision' : `ret-decision-${d}`} type="radio" value={d} className="size-5 accent-temper" {...form.register('decision')} />
            <span className="text-lg font-semibold">{words[d]}</span>
            {amountFor(d) && <span className="tabular text-cast">{amountFor(d)}</span>}
          </label>
        ))}
        {errors.decision && (
          <p id="ret-decision-error" className="font-semibold text-oxide">
            {errors.decision.message}
          </p>
        )}
      </fieldset>
      {!core && (decision === 'full-refund' || decision === 'partial-refund') && (
        <FieldShell variant="floor" id="ret-restock" label="Back on the shelf">
          <label className="flex min-h-12 items-center gap-3">
            <input id="ret-restock" type="checkbox" className="size-6 accent-temper" aria-describedby="ret-restock-hint" {...form.register('restock')} />
            <span className="text-lg">Restock it</span>
          </label>
          <p id="ret-restock-hint" className="text-cast">
            Only a part graded “{CONDITION_GRADES['as-new']}” goes back into stock{grade && grade !== 'as-new' ? '; this one will not' : ''}.
          </p>
        </FieldShell>
      )}
      {decision === 'partial-refund' && (
        <div className="grid gap-5 sm:grid-cols-[16rem_1fr]">
          <TextField
            variant="floor"
            id="ret-amount"
            label={core ? 'Deposit to refund' : 'Refund amount'}
            inputMode="decimal"
            suffix="USD"
            placeholder={centsToDollarsInput(ret.maxRefundCents)}
            hint={`In dollars, at most ${formatPrice(ret.maxRefundCents)}.`}
            error={errors.amount?.message}
            {...form.register('amount')}
          />
          <TextAreaField variant="floor" id="ret-reason" label="Why less" maxLength={300} hint="The customer reads this, e.g. “cracked turbine housing”." error={errors.reason?.message} {...form.register('reason')} />
        </div>
      )}
      {decision === 'reject' && (
        <TextAreaField variant="floor" id="ret-reject" label="Reason for rejecting" maxLength={300} hint="The customer reads this in their e-mail." error={errors.rejectReason?.message} {...form.register('rejectReason')} />
      )}
      <div>
        <Button type="submit" size="lg" disabled={decide.isPending}>
          {decide.isPending ? 'Recording…' : decision === 'reject' ? (core ? 'Reject the core' : 'Reject the return') : core ? 'Refund the deposit and close' : 'Refund and close'}
        </Button>
      </div>
    </form>
  );
}

function Decided({ ret }: { ret: ReturnView }) {
  const how =
    ret.status === 'refunded'
      ? `Refunded ${formatPrice(ret.refundCents)} through the card.`
      : ret.status === 'credited'
        ? `Credit note ${ret.creditNoteNumber ?? ''} for ${formatPrice(ret.refundCents)} on the customer’s account.`
        : `Rejected: ${ret.rejectReason ?? 'no reason recorded'}.`;
  const ok = ret.status !== 'rejected';
  const why = ret.decisionReason ? `Less than the most because: ${ret.decisionReason}. ` : '';
  return (
    <div role="status" className={`flex items-start gap-3 rounded-lg border-4 p-4 ${ok ? 'border-machined bg-machined-tint' : 'border-oxide bg-oxide-tint'}`}>
      {ok ? <CircleCheckBig aria-hidden className="size-8 shrink-0 text-machined" /> : <Ban aria-hidden className="size-8 shrink-0 text-oxide" />}
      <div>
        <p className={`text-xl font-bold ${ok ? 'text-machined' : 'text-oxide'}`}>{how}</p>
        <p className="text-lg">
          {why}
          {ret.conditionGrade && <>Graded {CONDITION_GRADES[ret.conditionGrade]}. </>}
          {ret.decidedAt && <>Decided {formatDateTime(ret.decidedAt)}. </>}The customer has been e-mailed.
        </p>
      </div>
    </div>
  );
}
