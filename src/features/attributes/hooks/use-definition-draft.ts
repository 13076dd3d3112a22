import { useEffect, useState } from 'react';
import type { StudyDefinition } from '@shared/schemas/study-definition';

/**
 * The definition being edited, apart from the saved one. `dirty` compares JSON; a newer saved
 * definition replaces the draft only when there are no unsaved edits.
 */
export function useDefinitionDraft(saved: StudyDefinition) {
  const [base, setBase] = useState(saved);
  const [draft, setDraft] = useState(saved);
  const dirty = JSON.stringify(draft) !== JSON.stringify(base);
  if (saved !== base && !dirty) {
    setBase(saved);
    setDraft(saved);
  }
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);
  return {
    draft,
    setDraft,
    dirty,
    /** After a save: the server's copy becomes the new base. */
    markSaved: (next: StudyDefinition) => {
      setBase(next);
      setDraft(next);
    },
    discard: () => setDraft(base),
  };
}
