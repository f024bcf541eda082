import { useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input } from '@/components/ui/field';
import { describeError, ErrorState } from '@/components/ui/states';
import { photoFieldsSchema, photoLimits, usePhotos, useRemovePhoto, useUploadPhoto } from '../api/photos';

const ACCEPT = 'image/jpeg,image/png,image/webp,image/tiff';

function UploadForm({ resultId }: { resultId: number }) {
  const fileId = useId();
  const altId = useId();
  const fileInput = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [alt, setAlt] = useState('');
  const [errors, setErrors] = useState<{ file?: string; alt?: string }>({});
  const [sent, setSent] = useState(0);
  const upload = useUploadPhoto(resultId, setSent);

  const submit = () => {
    const next: typeof errors = {};
    if (!file) next.file = 'Choose a photo.';
    else if (file.size > photoLimits.fileBytesMax) next.file = `The photo is larger than ${photoLimits.fileBytesMax / (1024 * 1024)} MB.`;
    const parsed = photoFieldsSchema.safeParse({ alt });
    if (!parsed.success) next.alt = parsed.error.issues[0]?.message;
    setErrors(next);
    if (next.file || next.alt || !file) return;
    setSent(0);
    upload.mutate(
      { file, alt: parsed.data!.alt },
      {
        onSuccess: () => {
          setFile(null);
          setAlt('');
          if (fileInput.current) fileInput.current.value = '';
        },
      },
    );
  };

  return (
    <form
      aria-label="Add a photo"
      className="flex flex-col gap-3 rounded-md border border-rule bg-panel p-4"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <Field id={fileId} label="Photo" hint="JPEG, PNG, WebP or TIFF, up to 8 MB. It is re-encoded and its metadata (camera, GPS position) removed." error={errors.file}>
        <input ref={fileInput} {...controlA11y(fileId, { hint: true, error: errors.file })} type="file" accept={ACCEPT} onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
      </Field>
      <Field id={altId} label="Description (alt text)" hint="What the photo shows, for people who cannot see it: e.g. “Edge at 200× after the 1000 stone”." error={errors.alt}>
        <Input {...controlA11y(altId, { hint: true, error: errors.alt })} value={alt} maxLength={300} onChange={(e) => setAlt(e.target.value)} />
      </Field>
      {upload.isPending ? (
        <div role="progressbar" aria-label="Uploading the photo" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(sent * 100)} className="h-2 overflow-hidden rounded bg-paper">
          <div className="h-full bg-accent" style={{ width: `${Math.round(sent * 100)}%` }} />
        </div>
      ) : null}
      {upload.isError ? (
        <p role="alert" className="text-danger">
          {describeError(upload.error)}
        </p>
      ) : null}
      <div>
        <Button type="submit" busy={upload.isPending}>
          Upload photo
        </Button>
      </div>
    </form>
  );
}

/** A result's photos (thumbnails linking to the full image), and for its author the upload form. */
export function ResultPhotos({ resultId }: { resultId: number }) {
  const photos = usePhotos(resultId);
  const remove = useRemovePhoto(resultId);
  if (photos.isPending) return null;
  if (photos.isError) return <ErrorState error={photos.error} onRetry={() => photos.refetch()} title="The photos could not be loaded" />;
  const { items, max, canAdd } = photos.data;
  if (!items.length && !canAdd) return null;
  return (
    <section aria-labelledby="photos" className="flex flex-col gap-3">
      <h2 id="photos" className="text-xl font-semibold">
        Photos <span className="font-sans text-base font-normal text-muted">({items.length} of at most {max})</span>
      </h2>
      {items.length ? (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          {items.map((p) => (
            <li key={p.id} className="flex flex-col gap-1">
              <a href={p.url} target="_blank" rel="noreferrer">
                <img src={p.thumbUrl} alt={p.alt} loading="lazy" className="w-full rounded border border-rule bg-paper object-cover" />
              </a>
              <span className="text-sm text-muted">{p.alt}</span>
              {canAdd ? (
                <Button variant="quiet" size="sm" onClick={() => remove.mutate(p.id)} disabled={remove.isPending} aria-label={`Remove photo: ${p.alt}`}>
                  Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {canAdd && items.length < max ? <UploadForm resultId={resultId} /> : null}
    </section>
  );
}
