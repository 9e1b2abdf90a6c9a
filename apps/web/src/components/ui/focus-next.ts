/**
 * Enter moves on instead of submitting: to the next box marked `data-field` in the same
 * `data-field-scope` (hidden ones skipped), and after the last one to the scope's way on (an element
 * marked `data-field-end` inside the scope, else the nearest one outside it, such as "Next radiator").
 */
export function focusNextField(from: HTMLElement): void {
  const scope = from.closest<HTMLElement>('[data-field-scope]') ?? document.body;
  // Inside a closed <details> an element keeps its box (Chromium hides it with content-visibility), so ask both.
  const visible = (el: HTMLElement) =>
    el.getClientRects().length > 0 && !el.closest('details:not([open])') && !(el as HTMLInputElement).disabled;
  const fields = Array.from(scope.querySelectorAll<HTMLElement>('[data-field]')).filter(visible);
  const next = fields[fields.indexOf(from) + 1];
  if (next) {
    next.focus();
    return;
  }
  const end =
    scope.querySelector<HTMLElement>('[data-field-end]') ??
    from.closest<HTMLElement>('[data-field-end-scope]')?.querySelector<HTMLElement>('[data-field-end]');
  if (end && visible(end)) end.focus();
  else from.blur();
}
