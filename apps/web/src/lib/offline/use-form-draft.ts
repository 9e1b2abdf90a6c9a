import { useCallback, useEffect, useRef, useState, type RefObject } from 'react';
import { clearDraft, loadDraft, saveDraft } from '@/lib/offline/drafts';

interface FormDraft<E> {
  fields: Record<string, string>;
  extra?: E;
}

const SAVE_AFTER_MS = 250;

/** Puts saved values back into an uncontrolled form's fields (text, selects, radio groups, check boxes). */
function applyFields(form: HTMLFormElement, fields: Record<string, string>): void {
  for (const [name, value] of Object.entries(fields)) {
    const field = form.elements.namedItem(name);
    if (field instanceof RadioNodeList) field.value = value;
    else if (field instanceof HTMLInputElement && field.type === 'checkbox') field.checked = value === field.value;
    else if (field instanceof HTMLInputElement && field.type === 'file') continue;
    else if (field instanceof HTMLInputElement || field instanceof HTMLSelectElement) field.value = value;
    else if (field instanceof HTMLTextAreaElement) field.value = value;
  }
}

function readFields(form: HTMLFormElement): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const [name, value] of new FormData(form)) if (typeof value === 'string') fields[name] = value;
  return fields;
}

/**
 * Keeps an uncontrolled form as a draft on the phone (IndexedDB), from the first keystroke until the server has
 * it: a reload, a crash, a closed tab or a navigation brings it back. `extra` holds what the form keeps in state
 * (a chosen photo, a choice drawn as buttons); it is saved with the fields and handed back on restore.
 * Pass the same key to queueWrite as `draftKey`: the draft moves into the write when it is queued (the form starts
 * afresh) and comes back if the server refuses it. A key of null keeps nothing.
 */
export function useFormDraft<E = never>(
  formRef: RefObject<HTMLFormElement | null>,
  key: string | null,
  extra?: { value: E; restore: (value: E) => void },
) {
  const [restoredAt, setRestoredAt] = useState<number | null>(null);
  const extraValue = extra?.value;
  const extraRef = useRef(extra);
  const saveRef = useRef<(() => void) | null>(null);
  useEffect(() => {
    extraRef.current = extra;
  });

  useEffect(() => {
    const form = formRef.current;
    if (!form || !key) return;
    let cancelled = false;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const save = () => {
      if (timer) clearTimeout(timer);
      timer = null;
      const value: FormDraft<E> = { fields: readFields(form) };
      if (extraRef.current) value.extra = extraRef.current.value;
      void saveDraft(key, value);
    };
    const later = () => {
      if (timer) clearTimeout(timer);
      timer = setTimeout(save, SAVE_AFTER_MS);
    };
    const now = () => {
      if (timer) save();
    };
    void loadDraft<FormDraft<E>>(key).then((draft) => {
      if (cancelled) return;
      saveRef.current = later;
      if (!draft) return;
      applyFields(form, draft.value.fields);
      if (draft.value.extra !== undefined) extraRef.current?.restore(draft.value.extra);
      setRestoredAt(draft.savedAt);
    });
    form.addEventListener('input', later);
    form.addEventListener('change', later);
    // Saved before the submit handler queues the write, so the draft the queue marks is the one sent.
    form.addEventListener('submit', now, { capture: true });
    const onHide = () => {
      if (document.visibilityState === 'hidden') now();
    };
    document.addEventListener('visibilitychange', onHide);
    window.addEventListener('pagehide', now);
    return () => {
      cancelled = true;
      now();
      saveRef.current = null;
      form.removeEventListener('input', later);
      form.removeEventListener('change', later);
      form.removeEventListener('submit', now, { capture: true });
      document.removeEventListener('visibilitychange', onHide);
      window.removeEventListener('pagehide', now);
    };
  }, [formRef, key]);

  // A change of the state kept beside the fields is a keystroke too.
  useEffect(() => {
    if (extraValue !== undefined) saveRef.current?.();
  }, [extraValue]);

  const clear = useCallback(async () => {
    if (key) await clearDraft(key);
    setRestoredAt(null);
  }, [key]);

  return { restoredAt, clear };
}
