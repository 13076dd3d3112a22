/**
 * The preview frame tells the Preview section which screen it shows, so the section's screen
 * list follows a researcher who answers inside the frame. Same origin only.
 */
export const PREVIEW_SCREEN_MESSAGE = 'choicewright:preview-screen';

export type PreviewScreenMessage = { type: typeof PREVIEW_SCREEN_MESSAGE; index: number };

export function postPreviewScreen(index: number): void {
  if (window.parent === window) return;
  const message: PreviewScreenMessage = { type: PREVIEW_SCREEN_MESSAGE, index };
  window.parent.postMessage(message, window.location.origin);
}

/** Calls `onScreen` for messages of a preview frame of this origin; returns the remover. */
export function listenToPreviewScreens(onScreen: (index: number) => void): () => void {
  const listener = (e: MessageEvent) => {
    const data = e.data as Partial<PreviewScreenMessage> | null;
    if (e.origin !== window.location.origin || data?.type !== PREVIEW_SCREEN_MESSAGE) return;
    if (typeof data.index === 'number') onScreen(data.index);
  };
  window.addEventListener('message', listener);
  return () => window.removeEventListener('message', listener);
}
