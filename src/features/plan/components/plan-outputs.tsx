import type { ReactNode } from 'react';
import { ColourSwatch } from '../../../components/ui/colour-swatch';
import type { PlanOutputs } from '../../../../shared/plan/compute-plan';
import type { PlanDocument } from '../../../../shared/plan/plan-schema';
import { dentingLabel } from '../../../../shared/plan/reed';
import { metresToYards, toMetres } from '../../../../shared/plan/units';
import type { YarnAmount } from '../../../../shared/plan/warp';
import type { Draft } from '../../../../shared/weave/types';
import { density, length, num } from '../format';

// Enough of the sleying list to check the layer rule by eye; the whole list is at the loom.
const SLEYING_PREVIEW_DENTS = 12;

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-2 rounded-md border border-line bg-surface p-4">
      <h3 className="text-base font-semibold">{title}</h3>
      {children}
    </section>
  );
}

function Facts({ rows }: { rows: [string, ReactNode][] }) {
  return (
    <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
      {rows.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-muted">{label}</dt>
          <dd className="font-medium tabular-nums">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function YarnTable({ caption, amounts, draft, packages }: { caption: string; amounts: YarnAmount[]; draft: Draft; packages: boolean }) {
  return (
    <table className="w-full text-sm">
      <caption className="text-left font-medium">{caption}</caption>
      <thead>
        <tr className="text-left text-muted">
          <th scope="col" className="py-1 pr-2 font-normal">Colour</th>
          <th scope="col" className="py-1 pr-2 font-normal">Length</th>
          <th scope="col" className="py-1 pr-2 font-normal">Weight</th>
          {packages && <th scope="col" className="py-1 font-normal">Skeins or cones</th>}
        </tr>
      </thead>
      <tbody>
        {amounts.map((a) => (
          <tr key={a.color} className="border-t border-line">
            <td className="py-1 pr-2"><ColourSwatch draft={draft} color={a.color} /></td>
            <td className="py-1 pr-2 tabular-nums">{num(a.metres, 0)} m · {num(a.yards, 0)} yd</td>
            <td className="py-1 pr-2 tabular-nums">
              {a.grams === undefined ? 'give the yarn count' : `${num(a.grams, 0)} g · ${num((a.pounds ?? 0) * 16, 1)} oz`}
            </td>
            {packages && <td className="py-1 tabular-nums">{a.packages ?? '—'}</td>}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** What the plan works out: sett advice, the warp and weft, yarn to buy, the reed and sleying. */
export function PlanOutputsView({ outputs, plan, draft }: { outputs: PlanOutputs; plan: PlanDocument; draft: Draft }) {
  const { warp, settGuide, denting } = outputs;
  const u = plan.unit;
  const long = (v: number) => `${length(v, u)} (${num(toMetres(v, u), 2)} m · ${num(metresToYards(toMetres(v, u)), 2)} yd)`;
  const twoLayers = plan.layers > 1 ? ` (× ${plan.layers} for ${plan.layers} layers)` : '';
  const sleyPreview = outputs.sleying.flatMap((g) => g.items).slice(0, SLEYING_PREVIEW_DENTS);
  const layered = draft.warpLayers.some((l) => l > 1);
  return (
    <div className="flex flex-col gap-4" aria-label="Plan results">
      <Section title="Sett">
        <Facts
          rows={[
            ...(settGuide.fromWraps !== undefined ? [[`From wraps per inch${twoLayers}`, density(settGuide.fromWraps, u)] as [string, ReactNode]] : []),
            ...(settGuide.working
              ? [[`Working range for the warp yarn${twoLayers}`, `${num(settGuide.working.low)}–${density(settGuide.working.high, u)}`] as [string, ReactNode]]
              : []),
            ['Ends used', density(warp.sett, u)],
            ['Picks used', density(warp.picksPerUnit, u, 'picks')],
          ]}
        />
        {settGuide.outside && settGuide.working && (
          <p role="note" className="rounded-md border border-danger bg-danger-soft p-2 text-sm">
            <span aria-hidden="true">⚠ </span>
            {density(warp.sett, u)} is {num(settGuide.outside.by)} {settGuide.outside.direction} the working range for this yarn
            {plan.layers > 1 ? ` in ${plan.layers} layers` : ''} (Ashenhurst&apos;s rule): the cloth may be
            {settGuide.outside.direction === 'above' ? ' stiff or hard to beat in' : ' loose and shift'}. Weave a sample to be sure.
          </p>
        )}
        {settGuide.fromWraps === undefined && !settGuide.working && (
          <p className="text-sm text-muted">Give the warp yarn or its wraps per inch for sett advice.</p>
        )}
      </Section>

      <Section title="Warp">
        <Facts
          rows={[
            ['Width in the reed', `${length(warp.widthInReed, u, 2)} (asked: ${length(warp.targetWidthInReed, u, 2)})`],
            ['Finished size', `${length(warp.finished.width, u)} × ${length(warp.finished.length, u)}${plan.sizeFrom === 'finished' || warp.finished.width === plan.finishedWidth ? '' : ' (estimated with the allowances)'}`],
            ['Total ends', `${num(warp.ends.totalEnds, 0)} = ${warp.ends.repeats} repeats${plan.balanceEnds ? ` + ${plan.balanceEnds} balancing` : ''}${plan.selvedgeEndsPerSide ? ` + ${plan.selvedgeEndsPerSide * 2} selvedge` : ''}`],
            ['Woven length per piece', length(warp.wovenLengthPerPiece, u)],
            ['Warp length', long(warp.warpLength)],
            ['Picks in all', outputs.picksReason],
            ['Weft length', long(warp.weftLength)],
            ...(warp.bouts ? [['Bouts', `${warp.bouts.length}: ${warp.bouts.join(', ')} ends`] as [string, ReactNode]] : []),
          ]}
        />
      </Section>

      <Section title="Yarn to have">
        <YarnTable caption="Warp" amounts={warp.warpByColor} draft={draft} packages={!!plan.packageSize} />
        <YarnTable caption="Weft" amounts={warp.weftByColor} draft={draft} packages={!!plan.packageSize} />
      </Section>

      <Section title="Reed">
        <Facts
          rows={[
            ['Reed', `${num(plan.reed.dents)} dents ${plan.reed.per === '10cm' ? 'per 10 cm' : plan.reed.per === 'cm' ? 'per cm' : 'per inch'}`],
            ['Ends per dent', `${dentingLabel(denting.pattern)}${plan.denting ? '' : ' (planned from the sett)'}`],
            ['Sett this gives', `${density(denting.sett, u)} (${denting.difference >= 0 ? '+' : ''}${num(denting.difference, 2)} against the sett used)`],
            ...(outputs.centring
              ? [['Centred in the reed', `start at dent ${outputs.centring.firstDent} of ${outputs.centring.reedDents} (${outputs.centring.dentsUsed} dents used)`] as [string, ReactNode]]
              : []),
          ]}
        />
        <table className="w-full text-sm">
          <caption className="text-left font-medium">First dents, in sleying order{plan.lists.layerRule ? ' (layer rule on)' : ''}</caption>
          <thead>
            <tr className="text-left text-muted">
              <th scope="col" className="py-1 pr-2 font-normal">Dent</th>
              <th scope="col" className="py-1 font-normal">Ends sharing it</th>
            </tr>
          </thead>
          <tbody>
            {sleyPreview.map((d) => (
              <tr key={d.dent} className="border-t border-line">
                <td className="py-1 pr-2 tabular-nums">{d.dent}</td>
                <td className="py-1">
                  {d.ends.length === 0
                    ? 'empty'
                    : d.ends.map((e) => `${e.end}${layered ? ` (layer ${e.layer})` : ''}`).join(', ')}
                  {d.ends.length > 0 && d.ends.length < d.planned && ` — ${d.ends.length} of ${d.planned}: closed early by the layer rule`}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>
    </div>
  );
}
