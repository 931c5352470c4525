import { noChange, nothing } from 'lit';
import { Directive, directive, PartType, type PartInfo } from 'lit/directive.js';
import { setCommittedValue } from 'lit/directive-helpers.js';
import type { PropertyPart } from 'lit';

/**
 * `.value=${fieldValue(v)}` on a text field: the value the model gives it, without ever writing over text
 * being typed. The field shows `v` whenever `v` changes (an edit committed, undo, an import). While the field
 * has the focus, a re-render that brings the same `v` leaves its text alone: whatever re-renders the element
 * meanwhile (a run's results, the help line, another field committed) must not put the committed value back
 * over what the user is typing. Without the focus, the field is made to match `v`, as lit's `live` does.
 */
class FieldValue extends Directive {
  /** The model's value at the last render. */
  private last?: string;

  constructor(part: PartInfo) {
    super(part);
    if (part.type !== PartType.PROPERTY || part.name !== 'value') throw new Error('fieldValue() binds .value only');
  }

  render(value: string): string {
    return value;
  }

  override update(part: PropertyPart, [value]: [string]): unknown {
    if ((value as unknown) === noChange || (value as unknown) === nothing) return value;
    const el = part.element as HTMLInputElement;
    const moved = value !== this.last;
    this.last = value;
    if (!moved && ((el.getRootNode() as Document | ShadowRoot).activeElement === el || el.value === value)) return noChange;
    // lit skips a value equal to the one it wrote last; the field's text may differ from it, so write anyway
    setCommittedValue(part);
    return value;
  }
}

export const fieldValue = directive(FieldValue);
