import { LitElement, css, html, noChange, nothing, type PropertyValues } from 'lit';
import { hasProblems, tellValidity, withProblem, type FieldProblems } from './field-problems.js';
import { customElement, property, state } from 'lit/decorators.js';
import { live } from 'lit/directives/live.js';
import type { AuditChoices } from '../core/audit/index.js';
import { PARAM_SPECS, PRESETS, type CosmologyParams } from '../core/cosmology/index.js';
import { presetCovariance, type ParamCovariance } from '../core/cosmology/parameter-covariance.js';
import { decodeText } from '../core/audit/text-decoding.js';
import { MASS_FUNCTIONS } from '../core/halos/index.js';
import { IMF_PRESETS, parseCustomImf } from '../core/stars/index.js';
import { parseSfh } from '../core/stars/sfh.js';
import { AUDIT_NUMBER_SPECS, AUDIT_SWITCH_SPECS, type ChoiceNumberSpec } from './audit-number-specs.js';
import { described, FieldHelp, helpStyles } from './field-help.js';
import { isRounded, shortNumber } from './number-format.js';
import { fieldValue } from './field-value.js';

/**
 * The choices with the headline IMF. `headlineImf` is the IMF whose verdict heads each row without its
 * own `imf_ref`; the audit takes the first compared IMF as headline, so the panel also puts it first.
 */
export type PanelChoices = AuditChoices & { readonly headlineImf?: string };

export const headlineOf = (c: PanelChoices): string => (c.headlineImf && c.imfs.includes(c.headlineImf) ? c.headlineImf : c.imfs[0]);

/** The IMF list with `name` first (the headline), the others in their order. */
const withHeadline = (imfs: readonly string[], name: string): string[] => [name, ...imfs.filter((i) => i !== name)];

/** The growth-factor choices, with what each means (src/core/cosmology/growth.ts). */
const GROWTH: Record<string, string> = {
  'matter-lambda': 'matter and Λ only: radiation left out of the growth equation (the usual convention for halo mass functions)',
  'with-radiation': 'with radiation: photons and massless neutrinos (Ω_r from T_CMB and N_eff) in H(z) of the growth equation',
};

/** The intrinsic UV slope shown in the population section (computed in the worker). */
export interface UvSlopeView {
  readonly imf: string;
  readonly sfh: string;
  readonly ageMyr: number;
  readonly z: number;
  readonly beta?: number;
  readonly message?: string;
}

const TRANSFERS: Record<string, string> = { eh98: 'Eisenstein & Hu 1998', 'eh98-nowiggle': 'Eisenstein & Hu 1998, no wiggles', bbks: 'BBKS 1986' };
const SFHS = ['constant', 'burst', 'exp-declining', 'exp-rising', 'piecewise'];

/**
 * <choice-panel>: cosmology (preset + every parameter), haloes (mass function, transfer function,
 * collapse threshold), stellar populations (IMFs compared, headline IMF, custom IMF, SFH) and the audit
 * numbers. Property `choices` in; `choices-change` (detail: { choices }) on every valid change, and
 * `choices-validity` (detail: { source: 'choices', problems: { field, message }[] }) whenever the set of
 * invalid fields changes. An invalid entry is named next to its field and not sent. Explanations show
 * in the help line on focus and on hover.
 */
@customElement('choice-panel')
export class ChoicePanel extends LitElement {
  @property({ attribute: false }) choices?: PanelChoices;
  /** The headline IMF's intrinsic UV slope for the chosen SFH (from the worker), shown under the SFH. */
  @property({ attribute: false }) uvSlope?: UvSlopeView;
  /** Reads a covariance CSV (the core's parser, run in the worker); rejects with a message naming line and column. */
  @property({ attribute: false }) covarianceParser?: (text: string, name: string) => Promise<ParamCovariance>;
  @state() private covMessage = '';
  @state() private problems: FieldProblems = {};
  private lastSent?: PanelChoices;
  private readonly help = new FieldHelp(this);

  static styles = [
    helpStyles,
    css`
      :host { display: block; font-size: 0.9rem; }
      fieldset { border: 1px solid #ccc; margin: 0 0 0.6rem; padding: 0.4rem 0.6rem; min-width: 0; }
      legend { font-weight: 600; }
      .fields { display: flex; flex-wrap: wrap; gap: 0.2rem 0.5rem; align-items: flex-start; }
      label { display: inline-flex; flex-direction: column; margin: 0.2rem 0; max-width: 100%; }
      input[type='number'], input[type='text'] { font: inherit; width: 8rem; box-sizing: border-box; }
      input.wide { width: min(22rem, 100%); }
      select { font: inherit; max-width: 100%; }
      input[aria-invalid='true'] { outline: 2px solid #D55E00; background: #fde2d6; }
      .checks label { flex-direction: row; gap: 0.3rem; align-items: center; }
      .custom { display: flex; flex-wrap: wrap; gap: 0.4rem; align-items: flex-end; }
      .custom label { flex-direction: column; align-items: flex-start; }
      button { font: inherit; padding: 0.2rem 0.6rem; border: 1px solid #777; border-radius: 4px; background: #fafafa; cursor: pointer; }
      .err { color: #8a2b00; font-size: 0.8rem; display: block; }
      .note { font-size: 0.8rem; color: #444; margin: 0.2rem 0; }
      .help { position: sticky; top: 0; z-index: 1; }
      .help.on { background: #f4f8fb; }
      .cov { display: flex; flex-wrap: wrap; gap: 0.3rem 0.8rem; align-items: center; margin: 0.3rem 0 0; }
      .cov label.row { flex-direction: row; gap: 0.3rem; align-items: center; }
      label.button { display: inline-block; padding: 0.2rem 0.6rem; border: 1px solid #777; border-radius: 4px; background: #fafafa; cursor: pointer; }
      label.button:focus-within { outline: 2px solid #0072B2; }
      .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
    `,
  ];

  protected willUpdate(changed: PropertyValues<this>): void {
    // Choices from outside (undo, import, demo, link) replace whatever was being typed.
    if (changed.has('choices') && this.choices !== this.lastSent && hasProblems(this.problems)) {
      this.problems = {};
      this.tell();
    }
  }

  private tell(): void {
    tellValidity(this, 'choices', this.problems);
  }

  private setProblem(field: string, message: string): void {
    const next = withProblem(this.problems, field, message);
    if (next === this.problems) return;
    this.problems = next;
    this.tell();
  }

  private emit(next: PanelChoices): void {
    this.lastSent = next;
    this.dispatchEvent(new CustomEvent('choices-change', { detail: { choices: next }, bubbles: true, composed: true }));
  }

  /** A number typed into `field`, or undefined (with the problem named next to the field). */
  private num(field: string, label: string, raw: string, min: number, max: number, integer = false): number | undefined {
    const v = raw.trim() === '' ? Number.NaN : Number(raw);
    const bad = !Number.isFinite(v) ? `${label}: "${raw}" is not a number` : v < min || v > max ? `${label}: must lie in [${min}, ${max}] (got ${v})` : integer && !Number.isInteger(v) ? `${label}: must be a whole number` : '';
    this.setProblem(field, bad);
    return bad ? undefined : v;
  }

  private setNum(s: ChoiceNumberSpec, raw: string): void {
    const v = this.num(s.key, s.label, raw, s.min, s.max, s.integer);
    if (v === undefined || !this.choices) return;
    // An optional choice at its default leaves the key out, so records and links of the default stay as they were.
    const { [s.key]: _, ...rest } = this.choices;
    this.emit(s.optional && v === s.default ? (rest as PanelChoices) : { ...this.choices, [s.key]: v });
  }

  /** A yes/no choice; false (the default) leaves the key out. */
  private setSwitch(key: (typeof AUDIT_SWITCH_SPECS)[number]['key'], on: boolean): void {
    if (!this.choices) return;
    const { [key]: _, ...rest } = this.choices;
    this.emit(on ? { ...this.choices, [key]: true } : (rest as PanelChoices));
  }

  private setCosmo(key: keyof CosmologyParams, label: string, raw: string, min: number, max: number): void {
    const v = this.num(key, label, raw, min, max);
    if (v !== undefined && this.choices) this.emit({ ...this.choices, cosmology: { ...this.choices.cosmology, [key]: v } });
  }

  private setImfs(imfs: string[], headline: string): void {
    if (!this.choices) return;
    this.emit({ ...this.choices, imfs: withHeadline(imfs, headline), headlineImf: headline });
  }

  private toggleImf(name: string, on: boolean): void {
    if (!this.choices) return;
    const c = this.choices;
    const imfs = on ? [...c.imfs.filter((i) => i !== name), name] : c.imfs.filter((i) => i !== name);
    if (!imfs.length) {
      this.setProblem('imfs', 'keep at least one IMF');
      this.requestUpdate();
      return;
    }
    this.setProblem('imfs', '');
    const head = headlineOf(c);
    this.setImfs(imfs, imfs.includes(head) ? head : imfs[0]);
  }

  private customProblem(spec: string): string {
    try {
      if (!spec.startsWith('custom:')) throw new RangeError('write custom:m0:α1:m1[:α2:m2…], e.g. custom:0.1:1.3:0.5:2.3:100');
      parseCustomImf(spec); // the audit's own parser: the same rules and messages
      return '';
    } catch (e) {
      return `custom IMF: ${(e as Error).message}`;
    }
  }

  private addCustom(): void {
    const input = this.renderRoot.querySelector('#custom-imf') as HTMLInputElement;
    const spec = input.value.trim();
    const bad = this.customProblem(spec);
    this.setProblem('custom', bad);
    if (bad || !this.choices) return;
    if (!this.choices.imfs.includes(spec)) this.setImfs([...this.choices.imfs, spec], headlineOf(this.choices));
    input.value = '';
  }

  private setSfh(spec: string, field: string): void {
    try {
      parseSfh(spec);
    } catch (e) {
      this.setProblem(field, `star-formation history: ${(e as Error).message}`);
      return;
    }
    this.setProblem(field, '');
    if (this.choices) this.emit({ ...this.choices, sfh: spec });
  }

  /** One numeric input with its label, help, hidden description and problem. */
  private numberField(id: string, label: string, value: number, doc: string, onChange: (raw: string) => void, step = 'any') {
    const exact = isRounded(value) ? ` (exact value ${value})` : '';
    const text = `${label}: ${doc}${exact}`;
    return html`<label data-help=${text}>${label}<input
        type="number"
        step=${step}
        aria-describedby=${`d-${id}`}
        aria-invalid=${this.problems[id] ? 'true' : 'false'}
        .value=${this.problems[id] ? noChange : fieldValue(shortNumber(value))}
        data-v=${shortNumber(value)}
        @change=${(e: Event) => onChange((e.target as HTMLInputElement).value)}
      />${described(`d-${id}`, text)}${this.err(id)}</label>`;
  }

  private err(k: string) {
    return this.problems[k] ? html`<span class="err" role="alert">${this.problems[k]}</span>` : nothing;
  }

  /** The growth-factor choice; the default leaves the key out, so records and links of the default stay as they were. */
  private growthField(c: PanelChoices) {
    const g = c.growth ?? 'matter-lambda';
    return html`<label data-help=${`growth factor: ${GROWTH[g]}`}>growth factor<select aria-label="growth factor" @change=${(e: Event) => {
      const v = (e.target as HTMLSelectElement).value;
      const { growth: _, ...rest } = c;
      this.emit(v === 'matter-lambda' ? rest : { ...c, growth: v as 'with-radiation' });
    }}>
      ${Object.entries(GROWTH).map(([k, doc]) => html`<option value=${k} ?selected=${k === g} title=${doc}>${k}</option>`)}
    </select></label>`;
  }

  /** Where the ceiling's cosmological spread comes from: the preset's 1σ errors, or an imported covariance file. */
  private covarianceField(c: PanelChoices) {
    const preset = Object.keys(PRESETS).find((k) => JSON.stringify(PRESETS[k]) === JSON.stringify(c.cosmology));
    let presetSource: string;
    try {
      presetSource = preset ? presetCovariance(preset).source : `${presetCovariance('planck18').source} (the cosmology is not a preset: Planck 2018's errors are used)`;
    } catch (e) {
      presetSource = (e as Error).message;
    }
    const own = c.cosmologyCovariance;
    return html`<div class="cov" data-help="cosmological covariance: the 5×5 covariance of ω_b, ω_c, H0, n_s, σ8 whose draws give the ceiling's cosmological spread">
      <label class="row"><input type="radio" name="cov" .checked=${live(!own)} @change=${() => {
        if (!own) return;
        const { cosmologyCovariance: _, ...rest } = c;
        this.covMessage = '';
        this.emit(rest);
      }} />Use the preset's errors</label>
      <label class="row"><input type="radio" name="cov" .checked=${live(!!own)} ?disabled=${!own} />${own ? `imported: ${own.source}` : 'an imported file'}</label>
      <span class="note">${own ? html`in use: <strong>${own.source}</strong>` : html`from ${presetSource}`}</span>
      <label class="button">Import covariance CSV…<input class="visually-hidden" type="file" accept=".csv,text/csv,text/plain" aria-label="Import a covariance CSV file" @change=${this.importCovariance} /></label>
      ${this.covMessage ? html`<span class="err" role="alert">${this.covMessage}</span>` : nothing}
    </div>`;
  }

  private async importCovariance(e: Event): Promise<void> {
    const input = e.target as HTMLInputElement;
    const f = input.files?.[0];
    input.value = '';
    if (!f || !this.choices) return;
    try {
      if (!this.covarianceParser) throw new Error('the covariance reader is not ready yet; try again in a moment');
      const { text } = decodeText(new Uint8Array(await f.arrayBuffer()), f.name);
      const cov = await this.covarianceParser(text, f.name);
      this.covMessage = '';
      if (this.choices) this.emit({ ...this.choices, cosmologyCovariance: cov });
    } catch (err) {
      this.covMessage = `covariance not imported (the previous one stays): ${(err as Error).message}`;
    }
  }

  /** "Intrinsic UV slope β … = −2.45" for the headline IMF under the chosen SFH, or why there is none. */
  private uvSlopeLine(c: PanelChoices) {
    const u = this.uvSlope;
    if (!u || u.imf !== headlineOf(c) || u.sfh !== c.sfh) return html`<p class="note uv" aria-live="polite">Intrinsic UV slope β of the headline IMF: computing…</p>`;
    const what = `Intrinsic UV slope β (1300–2600 Å, dust-free) of ${u.imf} for the ${u.sfh} history at ${u.ageMyr} Myr${u.imf === 'top-heavy-cmb' ? ` (z = ${u.z})` : ''}`;
    return html`<p class="note uv" aria-live="polite">${u.beta !== undefined ? html`${what}: <strong>${u.beta.toFixed(2)}</strong>` : `${what}: ${u.message}`}</p>`;
  }

  render() {
    const c = this.choices;
    if (!c) return nothing;
    const sfhKind = c.sfh.split(':')[0];
    const head = headlineOf(c);
    const presetName = Object.keys(PRESETS).find((k) => JSON.stringify(PRESETS[k]) === JSON.stringify(c.cosmology));
    const imfLabel = (name: string) => IMF_PRESETS.find((p) => p.name === name)?.label ?? name;
    const transferKnown = c.transfer.kind in TRANSFERS;
    return html`
      ${this.help.line()}
      <fieldset>
        <legend>Cosmology and haloes</legend>
        <div class="fields">
          <label data-help="preset: a published parameter set; any parameter can then be changed">preset<select aria-label="cosmology preset" @change=${(e: Event) => {
            const k = (e.target as HTMLSelectElement).value;
            if (PRESETS[k]) this.emit({ ...c, cosmology: PRESETS[k] });
          }}>
            ${presetName ? nothing : html`<option value="" selected>(own values)</option>`}
            ${Object.keys(PRESETS).map((k) => html`<option value=${k} ?selected=${k === presetName}>${k}</option>`)}
          </select></label>
          ${PARAM_SPECS.map((s) =>
            this.numberField(s.key, `${s.label}${s.unit ? ` [${s.unit}]` : ''}`, c.cosmology[s.key], `${s.doc}; allowed ${s.min} to ${s.max}`, (raw) => this.setCosmo(s.key, s.label, raw, s.min, s.max)),
          )}
          <label data-help="mass function: the halo multiplicity function that counts haloes">mass function<select aria-label="mass function" @change=${(e: Event) => this.emit({ ...c, massFunction: (e.target as HTMLSelectElement).value })}>
            ${Object.values(MASS_FUNCTIONS).map((m) => html`<option value=${m.name} ?selected=${m.name === c.massFunction}>${m.label}</option>`)}
          </select></label>
          <label data-help="transfer function: the shape of the linear power spectrum">transfer function<select aria-label="transfer function" @change=${(e: Event) => {
            const k = (e.target as HTMLSelectElement).value;
            if (k in TRANSFERS) this.emit({ ...c, transfer: { kind: k as 'eh98' } });
          }}>
            ${transferKnown ? nothing : html`<option value="" selected>${c.transfer.kind} (from the record)</option>`}
            ${Object.entries(TRANSFERS).map(([t, label]) => html`<option value=${t} ?selected=${t === c.transfer.kind}>${t} (${label})</option>`)}
          </select></label>
          <label data-help="collapse threshold δc: a constant, or 1.686[1 + 0.0123 log10 Ωm(z)] (Kitayama & Suto 1996)">collapse threshold δc<select aria-label="collapse threshold" @change=${(e: Event) => {
            const k = (e.target as HTMLSelectElement).value;
            this.emit({ ...c, deltaC: k === 'omega-m' ? { kind: 'omega-m' } : { kind: 'constant', value: 1.686 } });
          }}>
            <option value="constant" ?selected=${c.deltaC.kind === 'constant'}>constant</option>
            <option value="omega-m" ?selected=${c.deltaC.kind === 'omega-m'}>with Ωm(z)</option>
          </select></label>
          ${c.deltaC.kind === 'constant'
            ? this.numberField('deltaC', 'δc value', c.deltaC.value, 'the constant collapse threshold; allowed 1 to 2.5', (raw) => {
                const v = this.num('deltaC', 'δc', raw, 1, 2.5);
                if (v !== undefined) this.emit({ ...c, deltaC: { kind: 'constant', value: v } });
              })
            : nothing}
          ${this.growthField(c)}
        </div>
        ${this.covarianceField(c)}
      </fieldset>
      <fieldset class="imfs">
        <legend>Stellar populations</legend>
        <div class="fields checks">
          ${IMF_PRESETS.map((p) => html`<label data-help=${`${p.label}: ${p.source}`}><input type="checkbox" .checked=${live(c.imfs.includes(p.name))} @change=${(e: Event) => this.toggleImf(p.name, (e.target as HTMLInputElement).checked)} />${p.label}${p.topHeavy && !/top-heavy/i.test(p.label) ? ' (top-heavy)' : ''}</label>`)}
          ${c.imfs.filter((i) => i.startsWith('custom:')).map((i) => html`<label data-help=${`your own IMF: ${i}`}><input type="checkbox" checked @change=${(e: Event) => this.toggleImf(i, (e.target as HTMLInputElement).checked)} />${i}</label>`)}
        </div>
        ${this.err('imfs')}
        <div class="custom">
          <label data-help="custom IMF: power laws dN/dm ∝ m^−α between the listed masses in Msun, up to 300 Msun; Enter adds it">custom IMF<input
            id="custom-imf"
            class="wide"
            type="text"
            placeholder="custom:0.1:1.3:0.5:2.3:100"
            aria-invalid=${this.problems.custom ? 'true' : 'false'}
            @keydown=${(e: KeyboardEvent) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                this.addCustom();
              }
            }}
            @input=${(e: Event) => {
              // A message about the custom IMF goes as soon as the text is right (or empty).
              if (!this.problems.custom) return;
              const spec = (e.target as HTMLInputElement).value.trim();
              if (!spec || !this.customProblem(spec)) this.setProblem('custom', '');
            }}
          /></label>
          <button type="button" @click=${this.addCustom}>Add IMF</button>
        </div>
        ${this.err('custom')}
        <div class="fields">
          <label data-help="headline IMF: the verdict of a row without its own imf_ref is the one under this IMF; it is always compared">headline IMF<select aria-label="headline IMF" @change=${(e: Event) => this.setImfs([...c.imfs], (e.target as HTMLSelectElement).value)}>
            ${c.imfs.map((i) => html`<option value=${i} ?selected=${i === head}>${imfLabel(i)}</option>`)}
          </select></label>
          <label data-help="star-formation history: constant, a single burst, exponentially declining or rising (τ in Myr), or piecewise SFR at lookback ages">star-formation history<select aria-label="star-formation history" @change=${(e: Event) => {
            const k = (e.target as HTMLSelectElement).value;
            this.setSfh(k.startsWith('exp') ? `${k}:100` : k === 'piecewise' ? 'piecewise:0:1:100:1' : k, 'sfh');
          }}>
            ${SFHS.map((k) => html`<option value=${k} ?selected=${k === sfhKind}>${k}</option>`)}
          </select></label>
          ${sfhKind.startsWith('exp')
            ? this.numberField('tau', 'τ [Myr]', Number(c.sfh.split(':')[1] ?? '100'), 'e-folding time of the star-formation rate; allowed 1 to 100000 Myr', (raw) => {
                const v = this.num('tau', 'τ', raw, 1, 1e5);
                if (v !== undefined) this.setSfh(`${sfhKind}:${v}`, 'tau');
              })
            : nothing}
          ${sfhKind === 'piecewise'
            ? html`<label data-help="piecewise history: piecewise:a0:s0:a1:s1… gives the SFR s at lookback ages a in Myr, linear between points">history points<input
                class="wide"
                type="text"
                aria-invalid=${this.problems.sfh ? 'true' : 'false'}
                .value=${fieldValue(c.sfh)}
                @change=${(e: Event) => this.setSfh((e.target as HTMLInputElement).value.trim(), 'sfh')}
              /></label>`
            : nothing}
        </div>
        ${this.err('sfh')}
        ${this.uvSlopeLine(c)}
      </fieldset>
      <fieldset>
        <legend>Audit</legend>
        <div class="fields">
          ${AUDIT_NUMBER_SPECS.map((s) =>
            this.numberField(s.key, `${s.label}${s.unit ? ` [${s.unit}]` : ''}`, c[s.key] ?? s.default!, `${s.doc}; allowed ${s.min} to ${s.max}${s.integer ? ', whole numbers' : ''}`, (raw) => this.setNum(s, raw), s.step),
          )}
          ${AUDIT_SWITCH_SPECS.map((s) => {
            const text = `${s.label}: ${s.doc}`;
            return html`<label class="row" data-help=${text}><input type="checkbox" aria-describedby=${`d-${s.key}`} .checked=${live(c[s.key] ?? s.default)} @change=${(e: Event) => this.setSwitch(s.key, (e.target as HTMLInputElement).checked)} />${s.label}${described(`d-${s.key}`, text)}</label>`;
          })}
        </div>
      </fieldset>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'choice-panel': ChoicePanel;
  }
}
