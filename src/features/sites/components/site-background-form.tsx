import { useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { ImageOff, Trash2, Upload } from 'lucide-react';
import { formatLength, fromDisplayLength, lengthUnitLabel } from '@shared/geometry';
import type { Site } from '@shared/schemas/sites';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, inputClasses, TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useDeleteSiteBackground } from '../api/delete-site-background';
import { useUploadSiteBackground } from '../api/upload-site-background';

// The server's limits (server/services/site-backgrounds.ts); checked here only to answer quickly.
const MAX_BYTES = 5 * 1024 * 1024;
const IMAGE_TYPES = ['image/png', 'image/jpeg', 'image/webp'];
const NUMBER = /^(\d+(\.\d*)?|\.\d+)$/;

const BackgroundFormSchema = z.object({
  image: z
    .custom<FileList>((v) => typeof FileList !== 'undefined' && v instanceof FileList, 'Choose an image')
    .refine((files) => files.length === 1, 'Choose an image')
    .refine((files) => !files[0] || IMAGE_TYPES.includes(files[0].type), 'Use a PNG, JPEG or WebP image')
    .refine((files) => !files[0] || files[0].size <= MAX_BYTES, 'The image is larger than 5 MB'),
  width: z
    .string()
    .trim()
    .refine((v) => v === '' || (NUMBER.test(v) && Number(v) > 0), 'Enter a number more than 0, or leave it blank'),
});
type BackgroundFormValues = z.input<typeof BackgroundFormSchema>;

function sizeText(bytes: number): string {
  return bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} kB` : `${Number((bytes / 1024 / 1024).toFixed(1))} MB`;
}

function CurrentBackground({ site }: { site: Site }) {
  const remove = useDeleteSiteBackground(site.id);
  const [confirming, setConfirming] = useState(false);
  const background = site.background;
  if (!background) {
    return (
      <div className="flex items-center gap-3 rounded-lg border border-dashed border-paper-300 p-4 text-stone">
        <ImageOff className="size-6 shrink-0" aria-hidden="true" />
        <p>No background yet. The map shows plain ground until you add one.</p>
      </div>
    );
  }
  const spans =
    background.metresPerPixel === null
      ? 'Its real width is not set, so the map does not show it yet: upload it again with its width.'
      : `It spans ${formatLength(background.metresPerPixel * background.widthPx, site.units)} across.`;
  return (
    <figure className="flex flex-col gap-3">
      <img
        src={background.url}
        alt={`The current map background of ${site.name}`}
        width={background.widthPx}
        height={background.heightPx}
        className="max-h-72 w-full rounded-lg border border-paper-200 bg-paper-100 object-contain"
      />
      <figcaption className="text-sm text-stone">
        {background.widthPx} × {background.heightPx} pixels. {spans}
      </figcaption>
      {remove.isError && <Alert tone="error">Removing didn't work: {remove.error.message}</Alert>}
      {confirming ? (
        <div className="flex flex-wrap items-center gap-3" role="group" aria-label="Confirm removal">
          <span className="font-medium">Remove the background from the map?</span>
          <Button
            variant="danger"
            loading={remove.isPending}
            loadingText="Removing…"
            onClick={() => remove.mutate(undefined, { onSuccess: () => setConfirming(false) })}
          >
            Yes, remove it
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(false)} disabled={remove.isPending}>
            Keep it
          </Button>
        </div>
      ) : (
        <Button variant="secondary" className="self-start" onClick={() => setConfirming(true)}>
          <Trash2 className="size-5" aria-hidden="true" />
          Remove background
        </Button>
      )}
    </figure>
  );
}

/** Shows a site's map background and uploads a new one with the real width it covers. */
export function SiteBackgroundForm({ site }: { site: Site }) {
  const upload = useUploadSiteBackground(site.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const unit = lengthUnitLabel(site.units);
  const formElement = useRef<HTMLFormElement>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<BackgroundFormValues>({
    resolver: zodResolver(BackgroundFormSchema),
    defaultValues: { width: '' },
  });

  const submit = (values: BackgroundFormValues) => {
    setFormError(null);
    setDone(null);
    const image = values.image[0];
    const width = values.width.trim();
    upload.mutate(
      { image, widthMetres: width === '' ? undefined : fromDisplayLength(Number(width), site.units) },
      {
        onSuccess: () => {
          // A file input can only be emptied through the DOM; the native reset does that.
          formElement.current?.reset();
          reset({ width: '' });
          setDone(`Uploaded ${image.name}. The map now shows it under the plots.`);
        },
        onError: (error) => setFormError(applyServerErrors(error, setError, ['image'])),
      },
    );
  };

  return (
    <div className="flex flex-col gap-6">
      <CurrentBackground site={site} />
      <form ref={formElement} onSubmit={(event) => void handleSubmit(submit)(event)} noValidate className="flex flex-col gap-5">
        {formError && <Alert tone="error">{formError}</Alert>}
        {done && <Alert tone="success">{done}</Alert>}
        <Field
          label={site.background ? 'Replace with a new image' : 'Background image'}
          hint={`An aerial photo or a scanned plan: PNG, JPEG or WebP, up to ${sizeText(MAX_BYTES)}.`}
          error={errors.image?.message}
        >
          {({ inputId, describedBy, invalid }) => (
            <input
              id={inputId}
              type="file"
              accept="image/png,image/jpeg,image/webp"
              aria-describedby={describedBy}
              aria-invalid={invalid || undefined}
              className={`${inputClasses} cursor-pointer file:mr-3 file:rounded-md file:border-0 file:bg-paper-100 file:px-3 file:py-1 file:font-medium file:text-soil`}
              {...register('image')}
            />
          )}
        </Field>
        <TextField
          label={`Real width the image covers (${unit})`}
          hint="From its left edge to its right edge on the ground. The map needs it to draw the picture to scale; without it the picture is kept but not shown on the map."
          inputMode="decimal"
          autoComplete="off"
          className="sm:max-w-xs"
          error={errors.width?.message}
          {...register('width')}
        />
        <Button type="submit" loading={upload.isPending} loadingText="Uploading…" className="self-start">
          <Upload className="size-5" aria-hidden="true" />
          Upload background
        </Button>
      </form>
    </div>
  );
}
