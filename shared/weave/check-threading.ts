import { colourName } from './colour-names';
import { resolveLayers } from './layer-lists';
import type { Draft } from './types';
import { plural } from './words';

/** A count of ends sharing one value (a palette index or a layer). */
export interface Tally {
  value: number;
  count: number;
}

/** What a weaver sees when raising one shaft alone. */
export interface ShaftCensus {
  /** 1-based shaft. */
  shaft: number;
  /** 0-based ends threaded on it. */
  ends: number[];
  /** Palette indices of those ends, most common first. */
  colors: Tally[];
  /** 1-based layers of those ends, most common first. */
  layers: Tally[];
  /** The colour of at least three quarters of the ends of its layer; undefined when the shaft is mixed. */
  mainColor?: number;
  /** The layer of more than half of its ends: the layer this shaft weaves. */
  layer?: number;
}

export interface ThreadingProblem {
  /** 'layer': the end's layer differs from its shaft's; 'colour': only its colour differs. */
  kind: 'layer' | 'colour';
  /** 0-based end. */
  end: number;
  /** 1-based shaft. */
  shaft: number;
  message: string;
}

export interface ThreadingCheck {
  shafts: ShaftCensus[];
  problems: ThreadingProblem[];
}

/** A loom-side step: raise one shaft alone and look. */
export interface QuickCheck {
  shaft: number;
  ends: number;
  /** Palette index every end (bar the listed odd ones) should show; undefined for a mixed shaft. */
  color?: number;
  layer?: number;
  /** 0-based ends that should not be on this shaft as threaded. */
  oddEnds: number[];
  instruction: string;
}

function tally(values: Iterable<number>): Tally[] {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return [...counts].map(([value, count]) => ({ value, count })).sort((a, b) => b.count - a.count || a.value - b.value);
}

/**
 * For each shaft, the colours and layers of its ends, and the ends that break the pattern: an end
 * whose layer is not its shaft's layer (the layer of most of its ends), or whose colour differs on
 * a shaft where at least three quarters of the ends of that layer share one colour. Shafts with a
 * more even mix are taken as meant (colour stripes threaded across shafts).
 *
 * `warpLayers` overrides the draft's own layer list (same rules: empty = all 1, shorter repeats).
 *
 * Colours are named by yarn name, or "colour 3" where no yarn is named (see {@link colourName}).
 *
 * @example checkThreading(draft).problems[0].message // "End 37 (layer 1, colour 1) is on shaft 3, whose other 15 ends are layer 2 …"
 */
export function checkThreading(draft: Draft, warpLayers: readonly number[] = draft.warpLayers): ThreadingCheck {
  const ends = draft.threading.length;
  const layers = resolveLayers(warpLayers, ends);
  const onShaft: number[][] = Array.from({ length: draft.shafts }, () => []);
  draft.threading.forEach((shafts, e) => {
    for (const s of shafts) if (s >= 1 && s <= draft.shafts) onShaft[s - 1].push(e);
  });
  const shafts: ShaftCensus[] = onShaft.map((list, i) => {
    const colors = tally(list.map((e) => draft.warpColors[e] ?? 0));
    const layerTally = tally(list.map((e) => layers[e]));
    const census: ShaftCensus = { shaft: i + 1, ends: list, colors, layers: layerTally };
    if (layerTally.length > 0 && layerTally[0].count * 2 > list.length) census.layer = layerTally[0].value;
    // The shaft's colour is judged on the ends of its own layer, so one crossed end does not hide it.
    const own = census.layer === undefined ? list : list.filter((e) => layers[e] === census.layer);
    const ownColors = tally(own.map((e) => draft.warpColors[e] ?? 0));
    if (ownColors.length > 0 && ownColors[0].count * 4 >= own.length * 3) census.mainColor = ownColors[0].value;
    return census;
  });

  const problems: ThreadingProblem[] = [];
  for (const c of shafts) {
    for (const e of c.ends) {
      const color = draft.warpColors[e] ?? 0;
      const layer = layers[e];
      if (c.layer !== undefined && layer !== c.layer) {
        const others = c.layers.find((t) => t.value === c.layer)?.count ?? 0;
        problems.push({
          kind: 'layer',
          end: e,
          shaft: c.shaft,
          message:
            `End ${e + 1} (layer ${layer}, ${colourName(draft, color)}) is on shaft ${c.shaft}, ` +
            `whose other ${plural(others, 'end is', 'ends are')} layer ${c.layer}: it will weave into the wrong layer.`,
        });
      } else if (c.mainColor !== undefined && color !== c.mainColor) {
        problems.push({
          kind: 'colour',
          end: e,
          shaft: c.shaft,
          message:
            `End ${e + 1} is ${colourName(draft, color)} on shaft ${c.shaft}, ` +
            `where the other ends are ${colourName(draft, c.mainColor)}.`,
        });
      }
    }
  }
  problems.sort((a, b) => a.end - b.end || a.shaft - b.shaft);
  return { shafts, problems };
}

/**
 * Loom-side quick checks, one per shaft with ends: "raise shaft n alone — the ends on it should
 * all be colour X", naming the ends that will not be.
 */
export function quickChecks(draft: Draft, check: ThreadingCheck = checkThreading(draft)): QuickCheck[] {
  const odd = new Map<number, number[]>();
  for (const p of check.problems) odd.set(p.shaft, [...(odd.get(p.shaft) ?? []), p.end]);
  const layered = check.shafts.some((c) => c.layers.some((t) => t.value !== 1));
  return check.shafts
    .filter((c) => c.ends.length > 0)
    .map((c) => {
      const oddEnds = odd.get(c.shaft) ?? [];
      const layerText = layered && c.layer !== undefined ? ` (layer ${c.layer})` : '';
      let instruction: string;
      if (c.mainColor !== undefined) {
        instruction =
          `Raise shaft ${c.shaft} alone: ${c.ends.length === 1 ? 'its one end' : c.ends.length === 2 ? 'both ends on it' : `all ${c.ends.length} ends on it`}` +
          `${layerText} should be ${colourName(draft, c.mainColor)}.`;
        if (oddEnds.length > 0) instruction += ` As drawn, ${oddEnds.length === 1 ? 'end' : 'ends'} ${oddEnds.map((e) => e + 1).join(', ')} will not be.`;
      } else {
        const mix = c.colors.map((t) => `${t.count} of ${colourName(draft, t.value)}`).join(', ');
        instruction = `Raise shaft ${c.shaft} alone: its ${c.ends.length} ends${layerText} are mixed: ${mix}.`;
      }
      return { shaft: c.shaft, ends: c.ends.length, color: c.mainColor, layer: c.layer, oddEnds, instruction };
    });
}
