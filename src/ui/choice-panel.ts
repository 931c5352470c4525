import { LitElement, css, html, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import type { AuditChoices } from '../core/audit/index.js';
import { PARAM_SPECS, PRESETS, type CosmologyParams } from '../core/cosmology/index.js';
import { MASS_FUNCTIONS } from '../core/halos/index.js';
import { IMF_PRESETS, parseCustomImf } from '../core/stars/index.js';

type NumKey = 'epsRef' | 'quantile' | 'draws' | 'seed' | 'sliceDz' | 'formationZ';
const NUM_FIELDS: { key: NumKey; label: string; min: number; max: number; step: string; help: string }[] = [
  { key: 'epsRef', label: 'ε_ref', min: 0.0001, max: 1, step: '0.05', help: 'reference star-formation efficiency: above it a galaxy is strained' },
  { key: 'quantile', label: 'rarest-halo quantile', min: 0.5, max: 0.99999, step: '0.001', help: 'quantile of the most-massive-halo distribution used as the ceiling' },
  { key: 'draws', label: 'Monte Carlo draws', min: 100, max: 200000, step: '1000', help: 'draws per galaxy' },
  { key: 'seed', label: 'seed', min: -2147483647, max: 2147483647, step: '1', help: 'random seed (same seed, same numbers)' },
  { key: 'sliceDz', label: 'slice Δz', min: 0.1, max: 5, step: '0.1', help: 'width of the redshift slice around each galaxy' },
  { key: 'formationZ', label: 'formation z', min: 1, max: 100, step: '1', help: 'formation redshift for the time budget' },
];

/**
 * <choice-panel>: survey, cosmology (preset + overrides), halo and population choices.
 * Property `choices` in; `choices-change` (detail: { choices }) out on every valid user change.
 * An invalid entry is named next to its field and not sent.
 */
@customElement('choice-panel')
export class ChoicePanel extends LitElement {
  @property({ attribute: false }) choices?: AuditChoices;
  @state() private problems: Record<string, string> = {};

  static styles = css`
    :host { display: block; font-size: 0.9rem; }
    fieldset { border: 1px solid #ccc; margin: 0 0 0.6rem; padding: 0.4rem 0.6rem; }
    legend { font-weight: 600; }
    label { display: inline-flex; flex-direction: column; margin: 0.2rem 0.5rem 0.2rem 0; }
    input[type='number'], input[type='text'], select { font: inherit; width: 8rem; }
    .imfs label { flex-direction: row; gap: 0.3rem; align-items: center; }
    .err { color: #8a2b00; font-size: 0.8rem; }
  `;

  private emit(next: AuditChoices): void {
    this.dispatchEvent(new CustomEvent('choices-change', { detail: { choices: next }, bubbles: true, composed: true }));
  }

  private num(field: string, raw: string, min: number, max: number, integer = false): number | undefined {
    const v = raw.trim() === '' ? Number.NaN : Number(raw);
    const bad = !Number.isFinite(v) ? `${field}: "${raw}" is not a number` : v < min || v > max ? `${field}: must lie in [${min}, ${max}]` : integer && !Number.isInteger(v) ? `${field}: must be a whole number` : '';
    this.problems = { ...this.problems, [field]: bad };
    return bad ? undefined : v;
  }

  private setNum(key: NumKey, raw: string, min: number, max: number): void {
    const v = this.num(key, raw, min, max, key === 'draws' || key === 'seed');
    if (v !== undefined && this.choices) this.emit({ ...this.choices, [key]: v });
  }

  private setCosmo(key: keyof CosmologyParams, raw: string, min: number, max: number): void {
    const v = this.num(key, raw, min, max);
    if (v !== undefined && this.choices) this.emit({ ...this.choices, cosmology: { ...this.choices.cosmology, [key]: v } });
  }

  private setSurvey(key: 'areaArcmin2' | 'zMin' | 'zMax', raw: string): void {
    if (!this.choices) return;
    const v = this.num(key, raw, key === 'areaArcmin2' ? 1e-6 : 0, key === 'areaArcmin2' ? 148510660 : 30);
    if (v === undefined) return;
    const s = { ...this.choices.survey, [key]: v };
    if (!(s.zMax > s.zMin)) {
      this.problems = { ...this.problems, [key]: 'the redshift range needs z_min < z_max' };
      return;
    }
    this.emit({ ...this.choices, survey: s });
  }

  private toggleImf(name: string, on: boolean): void {
    if (!this.choices) return;
    const imfs = on ? [...this.choices.imfs, name] : this.choices.imfs.filter((i) => i !== name);
    if (!imfs.length) {
      this.problems = { ...this.problems, imfs: 'keep at least one IMF' };
      this.requestUpdate();
      return;
    }
    this.problems = { ...this.problems, imfs: '' };
    this.emit({ ...this.choices, imfs });
  }

  private addCustom(): void {
    const input = this.renderRoot.querySelector('#custom-imf') as HTMLInputElement;
    const spec = input.value.trim();
    try {
      if (!spec.startsWith('custom:')) throw new RangeError('write custom:m0:α1:m1[:α2:m2…], e.g. custom:0.1:1.3:0.5:2.3:100');
      parseCustomImf(spec); // the audit's own parser: the same rules and messages
    } catch (e) {
      this.problems = { ...this.problems, imfs: `custom IMF: ${(e as Error).message}` };
      return;
    }
    if (this.choices && !this.choices.imfs.includes(spec)) this.emit({ ...this.choices, imfs: [...this.choices.imfs, spec] });
    this.problems = { ...this.problems, imfs: '' };
  }

  render() {
    const c = this.choices;
    if (!c) return nothing;
    const err = (k: string) => (this.problems[k] ? html`<span class="err" role="alert">${this.problems[k]}</span>` : nothing);
    const sfhKind = c.sfh.split(':')[0];
    return html`
      <fieldset>
        <legend>Survey</legend>
        <label>area [arcmin²]<input type="number" step="any" .value=${String(c.survey.areaArcmin2)} @change=${(e: Event) => this.setSurvey('areaArcmin2', (e.target as HTMLInputElement).value)} />${err('areaArcmin2')}</label>
        <label>z min<input type="number" step="0.1" .value=${String(c.survey.zMin)} @change=${(e: Event) => this.setSurvey('zMin', (e.target as HTMLInputElement).value)} />${err('zMin')}</label>
        <label>z max<input type="number" step="0.1" .value=${String(c.survey.zMax)} @change=${(e: Event) => this.setSurvey('zMax', (e.target as HTMLInputElement).value)} />${err('zMax')}</label>
      </fieldset>
      <fieldset>
        <legend>Cosmology and haloes</legend>
        <label>preset<select aria-label="cosmology preset" @change=${(e: Event) => this.emit({ ...c, cosmology: PRESETS[(e.target as HTMLSelectElement).value] })}>
          ${Object.keys(PRESETS).map((k) => html`<option value=${k} ?selected=${JSON.stringify(PRESETS[k]) === JSON.stringify(c.cosmology)}>${k}</option>`)}
        </select></label>
        ${PARAM_SPECS.map((s) => html`<label title=${s.doc}>${s.label}${s.unit ? ` [${s.unit}]` : ''}<input type="number" step="any" .value=${String(c.cosmology[s.key])} @change=${(e: Event) => this.setCosmo(s.key, (e.target as HTMLInputElement).value, s.min, s.max)} />${err(s.key)}</label>`)}
        <label>mass function<select aria-label="mass function" @change=${(e: Event) => this.emit({ ...c, massFunction: (e.target as HTMLSelectElement).value })}>
          ${Object.values(MASS_FUNCTIONS).map((m) => html`<option value=${m.name} ?selected=${m.name === c.massFunction} title=${m.source}>${m.label}</option>`)}
        </select></label>
        <label>transfer function<select aria-label="transfer function" @change=${(e: Event) => this.emit({ ...c, transfer: { kind: (e.target as HTMLSelectElement).value as 'eh98' } })}>
          ${['eh98', 'eh98-nowiggle', 'bbks'].map((t) => html`<option value=${t} ?selected=${t === c.transfer.kind}>${t}</option>`)}
        </select></label>
      </fieldset>
      <fieldset class="imfs">
        <legend>Stellar populations</legend>
        ${IMF_PRESETS.map((p) => html`<label title=${p.source}><input type="checkbox" .checked=${c.imfs.includes(p.name)} @change=${(e: Event) => this.toggleImf(p.name, (e.target as HTMLInputElement).checked)} />${p.label}${p.topHeavy ? ' (top-heavy)' : ''}</label>`)}
        ${c.imfs.filter((i) => i.startsWith('custom:')).map((i) => html`<label><input type="checkbox" checked @change=${(e: Event) => this.toggleImf(i, (e.target as HTMLInputElement).checked)} />${i}</label>`)}
        <div>
          <label>custom IMF<input id="custom-imf" type="text" placeholder="custom:0.1:1.3:0.5:2.3:100" /></label>
          <button type="button" @click=${this.addCustom}>Add IMF</button>
        </div>
        ${err('imfs')}
        <div>
          <label>star-formation history<select aria-label="star-formation history" @change=${(e: Event) => {
            const k = (e.target as HTMLSelectElement).value;
            this.emit({ ...c, sfh: k.startsWith('exp') ? `${k}:100` : k });
          }}>
            ${['constant', 'burst', 'exp-declining', 'exp-rising'].map((k) => html`<option value=${k} ?selected=${k === sfhKind}>${k}</option>`)}
          </select></label>
          ${sfhKind.startsWith('exp')
            ? html`<label>τ [Myr]<input type="number" step="any" .value=${c.sfh.split(':')[1] ?? '100'} @change=${(e: Event) => {
                const v = this.num('tau', (e.target as HTMLInputElement).value, 1, 1e5);
                if (v !== undefined) this.emit({ ...c, sfh: `${sfhKind}:${v}` });
              }} />${err('tau')}</label>`
            : nothing}
        </div>
      </fieldset>
      <fieldset>
        <legend>Audit</legend>
        ${NUM_FIELDS.map((f) => html`<label title=${f.help}>${f.label}<input type="number" step=${f.step} .value=${String(c[f.key])} @change=${(e: Event) => this.setNum(f.key, (e.target as HTMLInputElement).value, f.min, f.max)} />${err(f.key)}</label>`)}
      </fieldset>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'choice-panel': ChoicePanel;
  }
}
