/**
 * Photos of one run, kept in memory only (a File cannot be stored in localStorage), so the
 * picker says so. Obvious mistakes are refused here with a sentence; the server checks content.
 */
import { useRef } from 'react';
import { useStore } from '@nanostores/react';
import { MAX_PHOTO_BYTES, MAX_PHOTOS } from '../../schemas/assessment-lists';
import { $photoMessages, $photos, addPhotos, removePhoto } from './store';

interface Props {
  runId: string;
  runTitle: string;
}

function size(bytes: number): string {
  return bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} kB` : `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

export function PhotoPicker({ runId, runTitle }: Props) {
  const photos = useStore($photos)[runId] ?? [];
  const message = useStore($photoMessages)[runId];
  const input = useRef<HTMLInputElement>(null);
  const id = `photos-${runId}`;
  return (
    <div className="group photos">
      <label htmlFor={id} className="field-label">
        Photos of this run <span className="field-optional">(optional)</span>
      </label>
      <p id={`${id}-hint`} className="field-hint">
        Photos are not kept if you reload the page; add them last. JPEG, PNG, WebP, HEIC or PDF, up to{' '}
        {Math.round(MAX_PHOTO_BYTES / (1024 * 1024))} MB each and {MAX_PHOTOS} in all. Photos lose their location data
        when stored; a PDF keeps its pages only (no scripts or attached files).
      </p>
      <input
        ref={input}
        id={id}
        type="file"
        multiple
        accept="image/jpeg,image/png,image/webp,image/heic,image/heif,.heic,.heif,application/pdf"
        className="file-input"
        aria-describedby={message ? `${id}-hint ${id}-error` : `${id}-hint`}
        onChange={(event) => {
          const files = Array.from(event.target.files ?? []);
          addPhotos(runId, files);
          // Clearing the picker lets the same file be chosen again after removing it.
          event.target.value = '';
        }}
      />
      {message && (
        <p id={`${id}-error`} className="field-error" role="alert">
          {message}
        </p>
      )}
      {photos.length > 0 && (
        <ul className="photo-list" aria-label={`Photos of ${runTitle}`}>
          {photos.map((file, index) => (
            <li key={`${file.name}-${index}`} className="photo-item">
              <span className="photo-name">{file.name}</span>
              <span className="photo-size">{size(file.size)}</span>
              <button
                type="button"
                className="link-button"
                onClick={() => {
                  removePhoto(runId, index);
                  input.current?.focus();
                }}
              >
                Remove<span className="sr-only"> {file.name}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
