// Forms with unsaved input register here, so an app update never reloads over them.
const dirtyForms = new Set<string>();

export function setDirty(formId: string, dirty: boolean): void {
  if (dirty) dirtyForms.add(formId);
  else dirtyForms.delete(formId);
}

export function hasUnsavedInput(): boolean {
  return dirtyForms.size > 0;
}

export const UNSAVED_QUESTION = 'You have readings on this page that are not saved yet. Leave and lose them?';

/**
 * Asks before the person leaves a page with unsaved input: an in-app link (caught before the router
 * sees the click) or closing and reloading the page. Returns the clean-up.
 */
export function guardUnsavedInput(confirmLeave: (question: string) => boolean = (q) => window.confirm(q)): () => void {
  const onClick = (event: MouseEvent) => {
    if (!hasUnsavedInput() || event.defaultPrevented || event.button !== 0) return;
    const link = (event.target as Element | null)?.closest?.('a[href]') as HTMLAnchorElement | null;
    if (!link || link.target === '_blank' || link.origin !== window.location.origin) return;
    if (link.pathname === window.location.pathname && link.search === window.location.search) return;
    if (confirmLeave(UNSAVED_QUESTION)) {
      dirtyForms.clear();
      return;
    }
    event.preventDefault();
    event.stopImmediatePropagation();
  };
  const onUnload = (event: BeforeUnloadEvent) => {
    if (!hasUnsavedInput()) return;
    event.preventDefault();
    event.returnValue = '';
  };
  document.addEventListener('click', onClick, true);
  window.addEventListener('beforeunload', onUnload);
  return () => {
    document.removeEventListener('click', onClick, true);
    window.removeEventListener('beforeunload', onUnload);
  };
}
