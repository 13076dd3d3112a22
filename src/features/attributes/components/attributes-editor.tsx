/**
 * The Attributes section's editor: attributes and levels (drag to reorder), alternatives,
 * opt-out / status quo and excluded combinations, saved as one definition. Errors from the
 * shared zod schema (before sending) or from the server are shown at their fields.
 */
import { useMemo, useState } from 'react';
import { studyDefinitionSchema, type StudyDefinition } from '@shared/schemas/study-definition';
import { ApiError } from '@/lib/api-client';
import { Alert, EmptyState } from '@/components/ui/feedback';
import { Button } from '@/components/ui/button';
import { fromServer, fromZod, type FieldErrors } from '../utils/field-errors';
import {
  makeAttribute,
  moveItem,
  normalizeDefinition,
  toDraftDefinition,
} from '../utils/definition-drafts';
import { useDefinitionDraft } from '../hooks/use-definition-draft';
import { AttributeCard } from './attribute-card';
import { SortableList } from './sortable-list';
import { AlternativesSettings } from './alternatives-settings';
import { FixedAlternativeSettings } from './fixed-alternative-settings';
import { ExcludedCombinationsEditor } from './excluded-combinations-editor';
import { SaveBar } from './save-bar';

type Props = {
  definition: StudyDefinition;
  readOnly: boolean;
  readOnlyReason?: string;
  save: (d: StudyDefinition) => Promise<{ definition: StudyDefinition; designDetached: boolean }>;
  uploadImage: (file: File) => Promise<{ key: string }>;
};

export function AttributesEditor({
  definition,
  readOnly,
  readOnlyReason,
  save,
  uploadImage,
}: Props) {
  const { draft, setDraft, dirty, markSaved, discard } = useDefinitionDraft(
    useMemo(() => toDraftDefinition(definition), [definition]),
  );
  const [errors, setErrors] = useState<FieldErrors>(new Map());
  const [saving, setSaving] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);

  const change = (next: StudyDefinition) => {
    setDraft(next);
    setNotice(null);
    // Once problems are shown, they clear as soon as the fields are fixed.
    if (errors.size > 0) {
      const checked = studyDefinitionSchema.safeParse(normalizeDefinition(next));
      setErrors(checked.success ? new Map() : fromZod(checked.error));
    }
  };
  const onSave = async () => {
    const candidate = normalizeDefinition(draft);
    const checked = studyDefinitionSchema.safeParse(candidate);
    if (!checked.success) {
      setErrors(fromZod(checked.error));
      return;
    }
    setSaving(true);
    setFormError(null);
    try {
      const saved = await save(checked.data);
      markSaved(toDraftDefinition(saved.definition));
      setErrors(new Map());
      setNotice(
        saved.designDetached
          ? 'The choice tasks no longer matched these attributes and were removed; generate them again.'
          : null,
      );
    } catch (err) {
      if (err instanceof ApiError && err.fields.length > 0) setErrors(fromServer(err.fields));
      else setFormError(err instanceof Error ? err.message : 'Saving failed.');
    } finally {
      setSaving(false);
    }
  };
  const topErrors = ['attributes', 'alternatives', 'fixedAlternative']
    .map((p) => errors.get(p))
    .filter(Boolean);

  return (
    <div className="space-y-6">
      {readOnly && readOnlyReason && <Alert tone="info">{readOnlyReason}</Alert>}
      {notice && <Alert tone="warning">{notice}</Alert>}
      {formError && <Alert tone="danger">{formError}</Alert>}
      {topErrors.length > 0 && (
        <Alert tone="danger" title="Please fix">
          <ul className="list-disc pl-5">
            {topErrors.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </Alert>
      )}

      <div>
        <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
          <h2 className="text-lg font-semibold text-ink">Attributes</h2>
          {!readOnly && (
            <div className="flex gap-2">
              <Button
                variant="secondary"
                size="sm"
                onClick={() =>
                  change({
                    ...draft,
                    attributes: [...draft.attributes, makeAttribute('categorical')],
                  })
                }
              >
                Add categorical attribute
              </Button>
              <Button
                variant="secondary"
                size="sm"
                onClick={() =>
                  change({ ...draft, attributes: [...draft.attributes, makeAttribute('numeric')] })
                }
              >
                Add numeric attribute
              </Button>
            </div>
          )}
        </div>
        {draft.attributes.length === 0 ? (
          <EmptyState title="No attributes yet">
            Attributes are the features that differ between alternatives, such as the price or the
            number of supply interruptions. Each needs at least two levels.
          </EmptyState>
        ) : (
          <SortableList
            items={draft.attributes}
            disabled={readOnly}
            className="space-y-4"
            itemName={(a) => `attribute ${a.name}`.trim()}
            onMove={(from, to) =>
              change({ ...draft, attributes: moveItem(draft.attributes, from, to) })
            }
            renderItem={(attribute, index, handle) => (
              <AttributeCard
                attribute={attribute}
                index={index}
                errors={errors}
                handle={handle}
                readOnly={readOnly}
                uploadImage={uploadImage}
                onChange={(a) =>
                  change({
                    ...draft,
                    attributes: draft.attributes.map((x) => (x.id === a.id ? a : x)),
                  })
                }
                onRemove={() =>
                  change({
                    ...draft,
                    attributes: draft.attributes.filter((x) => x.id !== attribute.id),
                  })
                }
              />
            )}
          />
        )}
      </div>

      <AlternativesSettings
        definition={draft}
        errors={errors}
        readOnly={readOnly}
        onChange={change}
      />
      <FixedAlternativeSettings
        definition={draft}
        errors={errors}
        readOnly={readOnly}
        onChange={change}
      />
      <ExcludedCombinationsEditor
        definition={draft}
        errors={errors}
        readOnly={readOnly}
        onChange={change}
      />

      {!readOnly && (
        <SaveBar
          dirty={dirty}
          saving={saving}
          errorCount={errors.size}
          message={null}
          onSave={() => void onSave()}
          onDiscard={() => {
            discard();
            setErrors(new Map());
          }}
        />
      )}
    </div>
  );
}
