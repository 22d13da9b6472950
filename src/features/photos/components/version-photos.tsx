import type { ChangeEvent } from 'react';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { usePhotos } from '../api/get-photos';
import { useUploadPhoto } from '../api/upload-photo';

/** Photos of the cloth woven from one version, and (for editors) a way to add one. */
export function VersionPhotos({ draftId, version, canUpload }: { draftId: number; version: number; canUpload: boolean }) {
  const photos = usePhotos(draftId);
  const upload = useUploadPhoto(draftId);
  const onFile = (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (file) upload.mutate({ version, file });
    event.target.value = '';
  };
  const mine = photos.data?.photos.filter((p) => p.version === version) ?? [];
  return (
    <section aria-labelledby={`photos-${version}`} className="flex flex-col gap-2 text-sm">
      <h3 id={`photos-${version}`} className="font-semibold">Photos of cloth from version {version}</h3>
      {photos.isPending ? <Spinner label="Loading photos…" /> : photos.isError ? (
        <ErrorNotice title="Could not load photos" error={photos.error} />
      ) : mine.length === 0 ? (
        <p className="text-muted">No photos yet.</p>
      ) : (
        <ul className="flex flex-wrap gap-2">
          {mine.map((p) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer">
                <img src={p.url} alt={`Cloth photo added by ${p.uploaderName}`} className="h-32 rounded-md border border-line object-cover" />
              </a>
            </li>
          ))}
        </ul>
      )}
      {canUpload && (
        <label className="flex flex-col gap-1">
          <span className="font-medium">Add a photo (JPEG, PNG or WebP, up to 5 MB)</span>
          <input type="file" accept="image/jpeg,image/png,image/webp" onChange={onFile} disabled={upload.isPending} />
        </label>
      )}
      {upload.isPending && <p role="status">Uploading…</p>}
      {upload.isError && <ErrorNotice title="Could not add the photo" error={upload.error} />}
    </section>
  );
}
