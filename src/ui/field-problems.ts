/**
 * The problems an element shows beside its fields, and the `choices-validity` event that tells the page
 * (source: the element that found them) which of its inputs are invalid. Shared by the choice panel and
 * the survey editor.
 */
export type FieldProblems = Readonly<Record<string, string>>;

/** The problems with `field` set to `message` ('' clears it), or the same object when nothing changes. */
export function withProblem(problems: FieldProblems, field: string, message: string): FieldProblems {
  return (problems[field] ?? '') === message ? problems : { ...problems, [field]: message };
}

/** Whether any field has a problem. */
export const hasProblems = (problems: FieldProblems): boolean => Object.values(problems).some(Boolean);

/** Fires `choices-validity` from `host` with the fields that have a problem. */
export function tellValidity(host: EventTarget, source: string, problems: FieldProblems): void {
  const list = Object.entries(problems).filter(([, m]) => m).map(([field, message]) => ({ field, message }));
  host.dispatchEvent(new CustomEvent('choices-validity', { detail: { source, problems: list }, bubbles: true, composed: true }));
}
