import { useEffect, useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { LINE_GROUP_LABELS, type LineGroup } from '@benchwright/contracts';
import { displayUnit, formatQuantity, unitPriceFactor, type LengthUnit } from '@benchwright/pricing/geometry';
import { ApiRequestError, Button, ChoicesList, formatMoney, Money, Notice, Panel } from '@benchwright/ui';
import { useSendEstimate, useUpdateEstimate, type OwnerEstimate } from '../api/estimates';
import { WithdrawAcceptance } from './withdraw-acceptance';
import { toCents, toDollars } from '../../../lib/money';

interface LineForm {
  id?: string;
  group: LineGroup;
  description: string;
  quantity: string;
  unit: string;
  unitPrice: string;
  costCents?: number;
  overrideReason: string;
}
interface EditorForm {
  lines: LineForm[];
  discount: string;
}

/**
 * The editor shows each quantity and unit price in the shop's units, as the client's estimate and the PDF do (a line
 * of banding, stored in metres, reads in feet for an imperial shop, and its price per foot); the stored line keeps
 * the engine's unit. `unitPriceFactor` is the price per shown unit over the price per stored unit, so a shown
 * quantity is the stored one divided by it.
 */
const shownQuantity = (quantity: number, unit: string, units: LengthUnit) =>
  String(Math.round((quantity / unitPriceFactor(unit, units)) * 100) / 100);
const shownPrice = (cents: number, unit: string, units: LengthUnit) =>
  toDollars(Math.round(cents * unitPriceFactor(unit, units)));

function formOf(e: OwnerEstimate): EditorForm {
  return {
    lines: e.lines.map((l) => ({
      id: l.id,
      group: l.group,
      description: l.description,
      quantity: shownQuantity(l.quantity, l.unit, e.units),
      unit: l.unit,
      unitPrice: shownPrice(l.unitPriceCents, l.unit, e.units),
      costCents: l.costCents,
      overrideReason: l.overrideReason ?? '',
    })),
    discount: toDollars(e.totals.discountCents),
  };
}

/**
 * A line as saved: a field the owner left as shown keeps the stored value exactly (a round trip through feet would
 * move it by a rounding and read as a change that needs a reason); a changed one is turned back to the stored unit.
 */
function storedLine(
  l: LineForm,
  shown: LineForm | undefined,
  stored: { quantity: number; unitPriceCents: number } | undefined,
  units: LengthUnit,
) {
  const f = unitPriceFactor(l.unit, units);
  const quantity = stored && shown && l.quantity === shown.quantity ? stored.quantity : Number(l.quantity) * f;
  const unitPriceCents =
    stored && shown && l.unitPrice === shown.unitPrice ? stored.unitPriceCents : Math.round(toCents(l.unitPrice) / f);
  return { quantity, unitPriceCents };
}

/** The owner's draft: quantities and prices editable, a reason for every change, manual lines, the discount, then send. */
export function EstimateEditor({ estimate }: { estimate: OwnerEstimate }) {
  const draft = estimate.status === 'draft';
  const form = useForm<EditorForm>({ defaultValues: formOf(estimate) });
  // every saved version becomes the form's new starting point (the page keeps the editor mounted, so its notices stay)
  useEffect(() => {
    form.reset(formOf(estimate));
  }, [estimate.version]); // eslint-disable-line react-hooks/exhaustive-deps -- reset only when a new version is saved, not on every refetch
  const lines = useFieldArray({ control: form.control, name: 'lines' });
  const update = useUpdateEstimate();
  const send = useSendEstimate();
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);

  const onSave = form.handleSubmit(async (v) => {
    setMessage(null);
    try {
      await update.mutateAsync({
        id: estimate.id,
        body: {
          version: estimate.version,
          discountCents: toCents(v.discount || '0'),
          lines: v.lines.map((l) => {
            const shown = l.id ? formOf(estimate).lines.find((x) => x.id === l.id) : undefined;
            const stored = l.id ? estimate.lines.find((x) => x.id === l.id) : undefined;
            return {
              id: l.id,
              group: l.group,
              description: l.description,
              ...storedLine(l, shown, stored, estimate.units),
              unit: l.unit,
              costCents: l.costCents,
              overrideReason: l.overrideReason.trim() || null,
            };
          }),
        },
      });
      setMessage({ tone: 'ok', text: 'Saved.' });
    } catch (err) {
      if (err instanceof ApiRequestError) {
        // the server names fields as lines[3].overrideReason; the form as lines.3.overrideReason
        for (const i of err.issues)
          form.setError(i.path.replace(/\[(\d+)\]/g, '.$1') as never, { type: 'server', message: i.message });
        setMessage({ tone: 'error', text: err.message });
      } else setMessage({ tone: 'error', text: 'The server could not be reached.' });
    }
  });

  /** "/ft" after a unit price shown per another unit than the line's stored one, as the quantity reads. */
  const per = (unit: string) =>
    unitPriceFactor(unit, estimate.units) !== 1 ? `/${displayUnit(unit, estimate.units)}` : '';
  const margin = estimate.totals.subtotalCents - estimate.totals.discountCents - estimate.costCents;
  const input = 'w-full rounded border border-rule bg-white px-2 py-1 text-right';
  return (
    <Panel title={`Estimate ${estimate.number}, revision ${estimate.revision} (${estimate.status})`}>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <p className="mb-3 text-ink-soft">
        Sheets:{' '}
        {estimate.layouts
          .map(
            (l) =>
              `${l.materialName} ${l.sheetCount} (least possible ${l.lowerBound}, yield ${Math.round(l.yieldRatio * 100)}%)`,
          )
          .join('; ')}
      </p>
      <ChoicesList
        heading="The client's choices"
        pieces={(estimate.choices ?? []).map((choices, i) => ({ title: estimate.drawings[i]?.title, choices }))}
      />
      <form onSubmit={onSave} noValidate aria-label="Edit the estimate">
        <table className="w-full border-collapse text-left" aria-label="Line items">
          <thead>
            <tr className="border-b-2 border-rule">
              <th className="py-1">Item</th>
              <th className="w-36 py-1 text-right">Quantity</th>
              <th className="w-36 py-1 text-right">{draft ? 'Unit price ($)' : 'Unit price'}</th>
              <th className="w-28 py-1 text-right">Amount</th>
              <th className="w-64 py-1 pl-4">Reason for a change</th>
            </tr>
          </thead>
          <tbody>
            {lines.fields.map((f, i) => {
              const err = form.formState.errors.lines?.[i];
              return (
                <tr key={f.id} className="border-b border-rule align-top">
                  <td className="py-1">
                    <span className="mr-2 text-xs uppercase text-ink-soft">{LINE_GROUP_LABELS[f.group]}</span>
                    {f.id ? (
                      f.description
                    ) : (
                      <input
                        aria-label={`Line ${i + 1} description`}
                        className="w-full rounded border border-rule bg-white px-2 py-1"
                        {...form.register(`lines.${i}.description`)}
                      />
                    )}
                  </td>
                  <td className="py-1">
                    {draft ? (
                      <span className="flex items-center gap-1">
                        <input
                          aria-label={`Line ${i + 1} quantity`}
                          className={input}
                          {...form.register(`lines.${i}.quantity`)}
                        />
                        <span className="w-10 text-sm text-ink-soft">{displayUnit(f.unit, estimate.units)}</span>
                      </span>
                    ) : (
                      <span className="block text-right" aria-label={`Line ${i + 1} quantity`}>
                        {estimate.lines[i]
                          ? formatQuantity(estimate.lines[i].quantity, estimate.lines[i].unit, estimate.units)
                          : f.quantity}
                      </span>
                    )}
                  </td>
                  <td className="py-1">
                    {draft ? (
                      <span className="flex items-center gap-1">
                        <input
                          aria-label={`Line ${i + 1} unit price`}
                          className={input}
                          {...form.register(`lines.${i}.unitPrice`)}
                        />
                        <span className="w-10 text-sm text-ink-soft">{per(f.unit)}</span>
                      </span>
                    ) : (
                      <span className="block text-right tabular-nums" aria-label={`Line ${i + 1} unit price`}>
                        {estimate.lines[i]
                          ? `${formatMoney(Math.round(estimate.lines[i].unitPriceCents * unitPriceFactor(f.unit, estimate.units)))}${per(f.unit)}`
                          : f.unitPrice}
                      </span>
                    )}
                  </td>
                  <td className="py-1 text-right">
                    {estimate.lines[i] ? <Money cents={estimate.lines[i].amountCents} /> : '—'}
                  </td>
                  <td className="py-1 pl-4">
                    {draft ? (
                      <input
                        aria-label={`Line ${i + 1} reason`}
                        aria-invalid={err?.overrideReason ? true : undefined}
                        className="w-full rounded border border-rule bg-white px-2 py-1"
                        {...form.register(`lines.${i}.overrideReason`)}
                      />
                    ) : (
                      <span aria-label={`Line ${i + 1} reason`}>{estimate.lines[i]?.overrideReason ?? '—'}</span>
                    )}
                    {err?.overrideReason ? (
                      <p role="alert" className="text-sm text-alert">
                        {err.overrideReason.message}
                      </p>
                    ) : null}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        {draft ? (
          <div className="mt-3 flex flex-wrap items-end gap-4">
            <Button
              type="button"
              variant="quiet"
              onClick={() =>
                lines.append({
                  group: 'other',
                  description: '',
                  quantity: '1',
                  unit: 'each',
                  unitPrice: '0.00',
                  overrideReason: '',
                })
              }
            >
              Add a line
            </Button>
            <label className="font-semibold">
              Discount ($){' '}
              <input
                aria-label="Discount"
                className="ml-2 w-28 rounded border border-rule bg-white px-2 py-1 text-right"
                {...form.register('discount')}
              />
            </label>
            <Button type="submit" disabled={update.isPending}>
              Save changes
            </Button>
          </div>
        ) : null}
      </form>
      <dl className="mt-4 grid max-w-md grid-cols-2 gap-y-1">
        <dt>Subtotal</dt>
        <dd className="text-right">
          <Money cents={estimate.totals.subtotalCents} />
        </dd>
        <dt>Discount</dt>
        <dd className="text-right">
          {estimate.totals.discountCents ? <Money cents={-estimate.totals.discountCents} /> : '—'}
        </dd>
        <dt>Tax</dt>
        <dd className="text-right" aria-label="Tax">
          <Money cents={estimate.totals.taxCents} />
        </dd>
        <dt className="font-bold">Total</dt>
        <dd className="text-right font-bold" aria-label="Total">
          <Money cents={estimate.totals.totalCents} />
        </dd>
        <dt>Deposit</dt>
        <dd className="text-right">
          <Money cents={estimate.totals.depositCents} />
        </dd>
        <dt>Our cost</dt>
        <dd className="text-right">
          <Money cents={estimate.costCents} />
        </dd>
        <dt>Margin</dt>
        <dd className="text-right">
          <Money cents={margin} />
        </dd>
      </dl>
      {draft ? (
        <div className="mt-4">
          {send.isError ? <Notice tone="error">{send.error.message}</Notice> : null}
          <Button
            onClick={() =>
              send.mutate(estimate.id, {
                onSuccess: () => setMessage({ tone: 'ok', text: 'Sent to the client with the PDF attached.' }),
              })
            }
            disabled={send.isPending || form.formState.isDirty}
          >
            {form.formState.isDirty ? 'Save before sending' : 'Send to the client'}
          </Button>
        </div>
      ) : null}
      {estimate.status === 'accepted' ? <WithdrawAcceptance estimate={estimate} /> : null}
    </Panel>
  );
}
