/**
 * When Next is refused, keyboard and screen-reader users land on the first thing to fix instead of
 * hunting for it: the first control marked invalid, or the first control beside a visible message.
 */
const CONTROL = 'input:not([type="hidden"]):not([tabindex="-1"]), select, textarea, button';

export function focusFirstError(container: HTMLElement | null): HTMLElement | null {
  if (!container) return null;
  const target = firstInvalidControl(container) ?? controlBesideFirstMessage(container);
  target?.focus();
  return target;
}

function firstInvalidControl(container: HTMLElement): HTMLElement | null {
  const marked = container.querySelector<HTMLElement>('[aria-invalid="true"]');
  if (!marked) return null;
  // A group (fieldset) is marked as a whole; focus its first choice.
  return marked.matches(CONTROL) ? marked : marked.querySelector<HTMLElement>(CONTROL);
}

function controlBesideFirstMessage(container: HTMLElement): HTMLElement | null {
  const message = container.querySelector<HTMLElement>('.field-error');
  if (!message) return null;
  for (let box = message.parentElement; box && box !== container.parentElement; box = box.parentElement) {
    const control = box.querySelector<HTMLElement>(CONTROL);
    if (control) return control;
  }
  return null;
}
