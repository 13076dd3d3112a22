/**
 * The respondent app's own words in the respondent's language (the session brings them): one
 * context for every screen and the shared choice-task card. English outside a session.
 */
import { createContext, useCallback, useContext } from 'react';
import {
  englishInterfaceTexts,
  fillText,
  type InterfaceTextKey,
  type InterfaceTexts,
} from '@shared/languages/interface-texts';

export const InterfaceTextsContext = createContext<InterfaceTexts>(englishInterfaceTexts);

/** `const t = useInterfaceText(); t('ui.task_progress', { n: 2, total: 8 })`. */
export function useInterfaceText() {
  const texts = useContext(InterfaceTextsContext);
  return useCallback(
    (key: InterfaceTextKey, values?: Record<string, string | number>) =>
      values ? fillText(texts[key], values) : texts[key],
    [texts],
  );
}
