import { useId, useState, type ReactNode } from 'react';
import type { Attribute, Level } from '@shared/schemas/study-definition';
import { checkLevelLabel, formatNumericLevel } from '@shared/study/level-labels';
import { formatCompact } from '@shared/format';
import { ApiError } from '@/lib/api-client';
import { FilePickButton } from '@/components/ui/file-pick-button';
import type { FieldErrors } from '../utils/field-errors';
import { confirmLevelLabel } from '../utils/definition-drafts';

type Props = {
  attribute: Attribute;
  level: Level;
  path: string;
  errors: FieldErrors;
  handle: ReactNode;
  readOnly: boolean;
  canRemove: boolean;
  onChange: (level: Level) => void;
  onRemove: () => void;
  uploadImage: (file: File) => Promise<{ key: string }>;
};

const input =
  'h-10 w-full rounded-md border border-line bg-white px-3 text-sm focus:border-primary focus:outline-none focus:ring-2 focus:ring-primary/20 aria-[invalid=true]:border-danger disabled:bg-canvas';

export function LevelRow(props: Props) {
  const { attribute, level, path, errors, handle, readOnly, canRemove, onChange, onRemove } = props;
  const id = useId();
  const [uploading, setUploading] = useState(false);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const labelError = errors.get(`${path}.label`);
  const valueError = errors.get(`${path}.value`);
  const numeric = attribute.kind === 'numeric';
  const labelCheck = checkLevelLabel(attribute, level);
  const drift = labelCheck === 'drifted' || labelCheck === 'confirmed';

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setUploading(true);
    setUploadError(null);
    try {
      const { key } = await props.uploadImage(file);
      onChange({ ...level, imageKey: key });
    } catch (err) {
      setUploadError(err instanceof ApiError ? err.message : 'The image could not be uploaded.');
    } finally {
      setUploading(false);
    }
  };

  return (
    <div className="flex flex-wrap items-start gap-2 rounded-md border border-line/70 bg-white p-2">
      {handle}
      {numeric && (
        <div className="w-20 sm:w-28">
          <label htmlFor={`${id}-v`} className="sr-only">
            Value
          </label>
          <input
            id={`${id}-v`}
            type="number"
            step="any"
            inputMode="decimal"
            placeholder="Value"
            className={`${input} num`}
            value={level.value ?? ''}
            disabled={readOnly}
            aria-invalid={valueError ? true : undefined}
            onChange={(e) =>
              onChange({
                ...level,
                value: e.target.value === '' ? undefined : Number(e.target.value),
              })
            }
          />
        </div>
      )}
      <div className="min-w-0 flex-1 basis-28">
        <label htmlFor={`${id}-l`} className="sr-only">
          {numeric ? 'Shown as' : 'Level label'}
        </label>
        <input
          id={`${id}-l`}
          className={input}
          placeholder={
            numeric
              ? level.value !== undefined
                ? `Shown as ${formatNumericLevel(level.value, attribute.unit)}`
                : 'Shown as'
              : 'Level label'
          }
          value={level.label}
          disabled={readOnly}
          aria-invalid={labelError ? true : undefined}
          aria-describedby={drift ? `${id}-drift` : undefined}
          onChange={(e) => onChange({ ...level, label: e.target.value })}
        />
        {drift && level.value !== undefined && (
          <LabelDrift
            id={`${id}-drift`}
            label={level.label.trim()}
            value={level.value}
            derived={formatNumericLevel(level.value, attribute.unit)}
            confirmed={labelCheck === 'confirmed'}
            readOnly={readOnly}
            onConfirm={(confirmed) => onChange(confirmLevelLabel(level, confirmed))}
          />
        )}
        {(labelError || valueError) && (
          <p role="alert" className="mt-1 text-xs font-medium text-danger">
            {labelError ?? valueError}
          </p>
        )}
        {uploadError && (
          <p role="alert" className="mt-1 text-xs font-medium text-danger">
            {uploadError}
          </p>
        )}
      </div>
      <div className="flex items-center gap-1">
        {level.imageKey ? (
          <span className="flex items-center gap-1">
            <img
              src={`/api/files/${encodeURIComponent(level.imageKey)}`}
              alt=""
              className="size-10 rounded border border-line object-cover"
            />
            {!readOnly && (
              <button
                type="button"
                className="h-10 rounded-md px-2 text-xs text-ink-soft hover:text-danger"
                onClick={() => onChange({ ...level, imageKey: undefined })}
              >
                Remove image
              </button>
            )}
          </span>
        ) : (
          !readOnly && (
            <FilePickButton
              className="flex h-10 cursor-pointer items-center rounded-md px-2 text-xs text-ink-soft hover:bg-primary-soft hover:text-primary"
              accept="image/png,image/jpeg,image/webp"
              onFile={(file) => void onFile(file)}
            >
              {uploading ? 'Uploading…' : 'Add image'}
            </FilePickButton>
          )
        )}
        {!readOnly && (
          <button
            type="button"
            aria-label={`Remove level ${level.label || (level.value ?? '')}`}
            disabled={!canRemove}
            className="flex size-10 items-center justify-center rounded-md text-ink-muted hover:bg-danger-soft hover:text-danger disabled:opacity-30"
            onClick={onRemove}
          >
            ✕
          </button>
        )}
      </div>
    </div>
  );
}

/**
 * A numeric level whose own label does not write its value: respondents would read one
 * number while the model codes another. The researcher either fixes the label (or clears it
 * to show the derived one) or confirms that this label is meant for this value.
 */
function LabelDrift(props: {
  id: string;
  label: string;
  value: number;
  derived: string;
  confirmed: boolean;
  readOnly: boolean;
  onConfirm: (confirmed: boolean) => void;
}) {
  const { id, label, value, derived, confirmed, readOnly, onConfirm } = props;
  return (
    <div
      id={id}
      className={
        confirmed
          ? 'mt-1 rounded-md bg-canvas px-2 py-1 text-xs text-ink-soft'
          : 'mt-1 rounded-md border border-accent/60 bg-accent-soft px-2 py-1 text-xs text-ink'
      }
    >
      <p>
        {confirmed ? 'Confirmed: ' : 'Check this label: '}respondents see “{label}” while the model
        codes {formatCompact(value)}. Clear it to show “{derived}”.
      </p>
      <label className="mt-1 flex items-center gap-2 font-medium">
        <input
          type="checkbox"
          className="size-4 accent-primary"
          checked={confirmed}
          disabled={readOnly}
          onChange={(e) => onConfirm(e.target.checked)}
        />
        “{label}” is meant for the value {formatCompact(value)}
      </label>
    </div>
  );
}
