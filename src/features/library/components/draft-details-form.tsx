import { useState, type FormEvent } from 'react';
import { MAX_NOTES_LENGTH, type Draft } from '../../../../shared/weave';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { useBinDraft } from '../../bin';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field, SelectField } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';
import { useSaveNotes, useUpdateDraft } from '../api/update-draft';
import { PlaceOptions, type StudioChoice } from './new-draft-form';

export interface DraftDetailsProps {
  draft: DraftDetail;
  document: Draft;
  /** Studios where the weaver is an owner or editor: where she may move the draft. */
  studios: readonly StudioChoice[];
}

/**
 * A draft's details, edited in one place: name, tags, where it lives, and notes. Name, tags and
 * place change no version; notes are part of the draft, so saving them makes a version.
 */
export function DraftDetailsForm({ draft, document, studios }: DraftDetailsProps) {
  const canEdit = draft.role !== 'viewer';
  return (
    <section aria-labelledby="details-heading" className="flex flex-col gap-4">
      <h2 id="details-heading" className="text-lg font-semibold">Details</h2>
      {canEdit ? (
        <DetailsEditor key={`${draft.name}|${draft.tags.join('|')}|${draft.studioId}`} draft={draft} studios={studios} />
      ) : (
        <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 text-sm">
          <dt className="text-muted">Name</dt>
          <dd>{draft.name}</dd>
          <dt className="text-muted">Tags</dt>
          <dd>{draft.tags.length > 0 ? draft.tags.join(', ') : 'none'}</dd>
          <dt className="text-muted">Lives in</dt>
          <dd>{draft.studioName ?? 'Personal drafts'}</dd>
        </dl>
      )}
      <NotesEditor key={draft.version} draft={draft} document={document} canEdit={canEdit} />
      {draft.role === 'owner' && <MoveToBin draft={draft} />}
    </section>
  );
}

function DetailsEditor({ draft, studios }: { draft: DraftDetail; studios: readonly StudioChoice[] }) {
  const update = useUpdateDraft(draft.id);
  const [name, setName] = useState(draft.name);
  const [tags, setTags] = useState<string[]>(draft.tags);
  const [newTag, setNewTag] = useState('');
  const [where, setWhere] = useState(draft.studioId === null ? '' : String(draft.studioId));
  const fields = fieldErrorsOf(update.error);
  // The studio it is in now stays on the list even when the weaver may not add drafts there.
  const places = draft.studioId !== null && draft.studioName !== null && !studios.some((s) => s.id === draft.studioId)
    ? [{ id: draft.studioId, name: draft.studioName }, ...studios]
    : studios;

  const addTag = () => {
    const tag = newTag.trim();
    if (tag && !tags.includes(tag)) setTags([...tags, tag]);
    setNewTag('');
  };
  const submit = (event: FormEvent) => {
    event.preventDefault();
    const studioId = where === '' ? null : Number(where);
    update.mutate({
      name: name.trim(),
      tags: newTag.trim() && !tags.includes(newTag.trim()) ? [...tags, newTag.trim()] : tags,
      ...(studioId !== draft.studioId ? { studioId } : {}),
    }, { onSuccess: () => setNewTag('') });
  };

  return (
    <form onSubmit={submit} aria-label="Name, tags and where the draft lives" className="flex flex-col gap-3">
      {update.isError && Object.keys(fields).length === 0 && <ErrorNotice title="Could not change the details" error={update.error} />}
      <div className="flex flex-wrap items-start gap-4">
        <div className="w-80">
          <Field label="Name" value={name} onChange={(e) => setName(e.target.value)} maxLength={200} error={fields.name} />
        </div>
        <div className="w-72">
          <SelectField label="Lives in" value={where} onChange={(e) => setWhere(e.target.value)} error={fields.studioId}
            hint="Moving it into a studio shares it with the studio's members.">
            <PlaceOptions studios={places} />
          </SelectField>
        </div>
      </div>
      <fieldset className="flex flex-col gap-2">
        <legend className="text-sm font-medium">Tags</legend>
        {tags.length > 0 ? (
          <ul aria-label="Tags of this draft" className="flex flex-wrap gap-2">
            {tags.map((tag) => (
              <li key={tag} className="flex items-center gap-1 rounded-full border border-line bg-surface py-0.5 pr-1 pl-3 text-sm">
                {tag}
                <button type="button" aria-label={`Remove tag ${tag}`} onClick={() => setTags(tags.filter((t) => t !== tag))}
                  className="inline-flex size-6 items-center justify-center rounded-full hover:bg-sunken">
                  <span aria-hidden="true">×</span>
                </button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-muted">No tags yet.</p>
        )}
        {fields.tags && <p className="text-sm text-danger">⚠ {fields.tags}</p>}
        <div className="flex items-end gap-2">
          <div className="w-56">
            <Field label="New tag" value={newTag} maxLength={50} onChange={(e) => setNewTag(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === 'Enter') {
                  e.preventDefault();
                  addTag();
                }
              }} />
          </div>
          <Button onClick={addTag} disabled={newTag.trim() === ''}>Add tag</Button>
        </div>
      </fieldset>
      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" busy={update.isPending} busyLabel="Saving…">Save details</Button>
        {update.isSuccess && <p role="status" className="text-sm">Details saved.</p>}
      </div>
    </form>
  );
}

function MoveToBin({ draft }: { draft: DraftDetail }) {
  const bin = useBinDraft();
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-2">
      <h3 className="text-sm font-medium">Delete</h3>
      <p className="text-sm text-muted">The draft goes to the Bin for 30 days, with its history, comments and photos; you can restore it from there until then.</p>
      {bin.isError && <ErrorNotice title="Could not delete the draft" error={bin.error} />}
      <div>
        <Button variant="danger" busy={bin.isPending} busyLabel="Moving to the Bin…"
          onClick={() => {
            if (!window.confirm(`Move “${draft.name}” to the Bin? You can restore it from the Bin for 30 days.`)) return;
            bin.mutate(draft.id, { onSuccess: () => navigate('/bin') });
          }}>
          Move to Bin
        </Button>
      </div>
    </div>
  );
}

function NotesEditor({ draft, document, canEdit }: { draft: DraftDetail; document: Draft; canEdit: boolean }) {
  const save = useSaveNotes(draft, document);
  const [notes, setNotes] = useState(document.notes);
  if (!canEdit) {
    return (
      <div className="flex flex-col gap-1 text-sm">
        <h3 className="font-medium">Notes</h3>
        <p className="whitespace-pre-wrap">{document.notes || 'No notes.'}</p>
      </div>
    );
  }
  return (
    <form
      aria-label="Notes"
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate(notes);
      }}
    >
      <label htmlFor="draft-notes" className="text-sm font-medium">Notes</label>
      <textarea id="draft-notes" value={notes} onChange={(e) => setNotes(e.target.value)} rows={5} maxLength={MAX_NOTES_LENGTH}
        className="block w-full max-w-3xl rounded-md border border-field bg-surface px-3 py-2 text-sm" />
      {save.isError && <ErrorNotice title="Could not save the notes" error={save.error} />}
      <div className="flex items-center gap-3">
        <Button type="submit" busy={save.isPending} busyLabel="Saving…" disabled={notes === document.notes}>Save notes</Button>
        <span className="text-xs text-muted">Notes are part of the draft: saving them makes a version.</span>
      </div>
    </form>
  );
}
