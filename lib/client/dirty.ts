// Forms with unsaved input register here, so an app update never reloads over them.
const dirtyForms = new Set<string>();

export function setDirty(formId: string, dirty: boolean): void {
  if (dirty) dirtyForms.add(formId);
  else dirtyForms.delete(formId);
}

export function hasUnsavedInput(): boolean {
  return dirtyForms.size > 0;
}
