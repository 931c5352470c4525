import { css, html, nothing, type ReactiveController, type ReactiveControllerHost, type TemplateResult } from 'lit';

/**
 * Explanations that keyboard users see too. Any element in the host's shadow tree with a `data-help`
 * attribute shows that text in the host's help line while it, or something inside it, has focus or is
 * under the pointer. For screen readers, `described(id, text)` renders a hidden description to point
 * `aria-describedby` at (hidden elements still serve as descriptions).
 */
export class FieldHelp implements ReactiveController {
  text = '';
  private focused = '';
  private hovered = '';

  constructor(private readonly host: ReactiveControllerHost & HTMLElement) {
    host.addController(this);
  }

  private find(e: Event): string {
    for (const n of e.composedPath()) {
      if (n === this.host || n === this.host.shadowRoot) break;
      if (n instanceof HTMLElement && n.dataset.help) return n.dataset.help;
    }
    return '';
  }

  private set(): void {
    const t = this.focused || this.hovered;
    if (t !== this.text) {
      this.text = t;
      this.host.requestUpdate();
    }
  }

  private onFocusIn = (e: Event): void => {
    this.focused = this.find(e);
    this.set();
  };
  private onFocusOut = (): void => {
    this.focused = '';
    this.set();
  };
  private onOver = (e: Event): void => {
    this.hovered = this.find(e);
    this.set();
  };
  private onLeave = (): void => {
    this.hovered = '';
    this.set();
  };

  /**
   * Listens on the shadow root: focus moving between two fields of the same element is not seen
   * by the host (the event's target and related target both retarget to it).
   */
  private get root(): EventTarget {
    return this.host.shadowRoot ?? this.host;
  }

  hostConnected(): void {
    this.root.addEventListener('focusin', this.onFocusIn);
    this.root.addEventListener('focusout', this.onFocusOut);
    this.root.addEventListener('pointerover', this.onOver);
    this.host.addEventListener('pointerleave', this.onLeave);
  }

  hostDisconnected(): void {
    this.root.removeEventListener('focusin', this.onFocusIn);
    this.root.removeEventListener('focusout', this.onFocusOut);
    this.root.removeEventListener('pointerover', this.onOver);
    this.host.removeEventListener('pointerleave', this.onLeave);
  }

  /** The visible help line (empty but holding its place when nothing is focused). */
  line(): TemplateResult {
    return html`<p class="help ${this.text ? 'on' : ''}" aria-hidden="true">${this.text || nothing}</p>`;
  }
}

/** A hidden description for `aria-describedby`. */
export const described = (id: string, text: string): TemplateResult => html`<span id=${id} hidden>${text}</span>`;

export const helpStyles = css`
  .help { min-height: 1.3em; margin: 0.2rem 0; font-size: 0.8rem; color: #333; background: #f4f8fb; border-left: 3px solid #0072B2; padding: 0.1rem 0.4rem; overflow-wrap: anywhere; }
  .help:not(.on) { background: none; border-color: transparent; }
`;
