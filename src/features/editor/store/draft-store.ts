import { applyPatches, enablePatches, produceWithPatches, type Patch } from 'immer';
import type { Draft } from '../../../../shared/weave';
import { createStore, type Store } from './create-store';
import type { Edit } from './edits';

enablePatches();

/** One undo step: everything one gesture changed (plain data, so it can be kept on the device). */
export interface Step {
  label: string;
  patches: Patch[];
  inverse: Patch[];
}

export interface DraftState {
  draft: Draft;
  /** Goes up on every change of the draft (edit, undo, redo, load), so savers can tell what they sent. */
  revision: number;
  undoLabel: string | null;
  redoLabel: string | null;
}

/** Steps kept: enough for a long sitting's edits, few enough that the patches stay small. */
export const HISTORY_LIMIT = 500;

/**
 * Asked before an edit's result is kept: false drops the edit. Undo, redo and loads are never
 * asked (they only go back to drafts the weaver has had).
 */
export type EditGuard = (before: Draft, after: Draft, label: string) => boolean;

export interface DraftStore extends Store<DraftState> {
  /** Runs an edit; inside a gesture it joins the gesture's one undo step. Returns true when the draft changed. */
  apply<A>(edit: Edit<A>, args: A): boolean;
  /** Starts a gesture (pointer down): every edit until {@link endGesture} undoes as one step. */
  beginGesture(label?: string): void;
  endGesture(): void;
  /** True between pointer down and up: heavy panels wait for the gesture to end. */
  inGesture(): boolean;
  undo(): boolean;
  redo(): boolean;
  /** Replaces the draft from outside (server copy, conflict choice): not an undo step, and history is cleared. */
  load(draft: Draft): void;
  /** The undo and redo steps, oldest first, to keep them through a reload. */
  history(): { past: Step[]; future: Step[] };
  /** Takes back steps kept by {@link history}; they must end at the current draft. */
  restoreHistory(steps: { past: Step[]; future: Step[] }): void;
}

/** The open draft and its undo history, as immer patches (tldraw/excalidraw style marks per gesture). */
export function createDraftStore(initial: Draft, guard: EditGuard = () => true): DraftStore {
  const store = createStore<DraftState>({ draft: initial, revision: 0, undoLabel: null, redoLabel: null });
  let past: Step[] = [];
  let future: Step[] = [];
  let gesture: Step | null = null;

  const publish = (draft: Draft) =>
    store.set((s) => ({
      draft,
      revision: draft === s.draft ? s.revision : s.revision + 1,
      undoLabel: gesture?.patches.length ? gesture.label : (past.at(-1)?.label ?? null),
      redoLabel: future.at(-1)?.label ?? null,
    }));

  const push = (step: Step) => {
    past.push(step);
    if (past.length > HISTORY_LIMIT) past = past.slice(past.length - HISTORY_LIMIT);
    // A new edit forks history: what was undone can no longer be redone.
    future = [];
  };

  const endGesture = () => {
    const g = gesture;
    gesture = null;
    if (g && g.patches.length > 0) push(g);
    publish(store.get().draft);
  };

  return {
    ...store,
    apply(edit, args) {
      const base = store.get().draft;
      const [next, patches, inverse] = produceWithPatches(base, (d) => {
        edit.recipe(d, args);
      });
      if (next === base || patches.length === 0) return false;
      const label = edit.labelFor(args);
      if (!guard(base, next, label)) return false;
      if (gesture) {
        if (gesture.patches.length === 0) gesture.label = label;
        gesture.patches.push(...patches);
        // Undoing a gesture runs its edits' inverses last-first.
        gesture.inverse = [...inverse, ...gesture.inverse];
        future = [];
      } else {
        push({ label, patches, inverse });
      }
      publish(next);
      return true;
    },
    beginGesture(label = 'Draw') {
      if (gesture) endGesture();
      gesture = { label, patches: [], inverse: [] };
    },
    endGesture,
    inGesture: () => gesture !== null,
    undo() {
      if (gesture) endGesture();
      const step = past.pop();
      if (!step) return false;
      future.push(step);
      publish(applyPatches(store.get().draft, step.inverse));
      return true;
    },
    redo() {
      if (gesture) endGesture();
      const step = future.pop();
      if (!step) return false;
      past.push(step);
      publish(applyPatches(store.get().draft, step.patches));
      return true;
    },
    load(draft) {
      past = [];
      future = [];
      gesture = null;
      publish(draft);
    },
    history: () => ({ past, future }),
    restoreHistory(steps) {
      past = steps.past.slice(-HISTORY_LIMIT);
      future = steps.future.slice();
      gesture = null;
      // Labels change, the draft does not: the revision stays, so nothing is taken for an edit.
      store.set((s) => ({ ...s, undoLabel: past.at(-1)?.label ?? null, redoLabel: future.at(-1)?.label ?? null }));
    },
  };
}
