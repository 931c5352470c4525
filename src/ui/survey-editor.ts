import { LitElement, css, html, noChange, nothing, type PropertyValues } from 'lit';
import { hasProblems, tellValidity, withProblem, type FieldProblems } from './field-problems.js';
import { customElement, property, state } from 'lit/decorators.js';
import { validateSurvey, type Survey } from '../core/audit/survey.js';
import { isStrictNumber } from '../core/numeric/strict-number.js';
import { described, FieldHelp, helpStyles } from './field-help.js';
import { shortNumber } from './number-format.js';
import { fieldValue } from './field-value.js';

export interface SurveyChoices {
  readonly survey: Survey;
  readonly surveys: readonly Survey[];
  readonly zBins: readonly (readonly [number, number])[];
}

type SurveyKey = 'name' | 'areaArcmin2' | 'zMin' | 'zMax';
const SURVEY_FIELDS: { key: SurveyKey; label: string; doc: string }[] = [
  { key: 'name', label: 'name', doc: 'the name used in the summary, the captions and the record' },
  { key: 'areaArcmin2', label: 'area [arcmin²]', doc: 'sky area searched, arcmin² (0 to the whole sky, 148510660.5)' },
  { key: 'zMin', label: 'z min', doc: 'lower end of the redshift range searched (0 ≤ z_min < z_max ≤ 30)' },
  { key: 'zMax', label: 'z max', doc: 'upper end of the redshift range searched (0 ≤ z_min < z_max ≤ 30)' },
];

/**
 * <survey-editor>: the default survey (name, area, redshift range), the named surveys that rows'
 * `survey` cells refer to, and the redshift bins of the sample densities. Property `value` in;
 * `survey-change` (detail: SurveyChoices) out on every valid edit; `choices-validity`
 * (detail: { source: 'survey', problems }) whenever the set of invalid fields changes.
 */
@customElement('survey-editor')
export class SurveyEditor extends LitElement {
  @property({ attribute: false }) value?: SurveyChoices;
  @state() private problems: FieldProblems = {};
  private lastSent?: SurveyChoices;
  private readonly help = new FieldHelp(this);

  static styles = [
    helpStyles,
    css`
      :host { display: block; font-size: 0.9rem; }
      fieldset { border: 1px solid #ccc; margin: 0 0 0.6rem; padding: 0.4rem 0.6rem; min-width: 0; }
      legend { font-weight: 600; }
      .fields { display: flex; flex-wrap: wrap; gap: 0.2rem 0.5rem; }
      label { display: inline-flex; flex-direction: column; }
      input { font: inherit; width: 7.5rem; box-sizing: border-box; }
      input[aria-invalid='true'] { outline: 2px solid #D55E00; background: #fde2d6; }
      .err { color: #8a2b00; font-size: 0.8rem; }
      table { border-collapse: collapse; margin: 0.2rem 0; }
      td, th { padding: 0.1rem 0.3rem 0.1rem 0; text-align: left; font-weight: normal; }
      .list { overflow-x: auto; }
      button { font: inherit; padding: 0.15rem 0.5rem; border: 1px solid #777; border-radius: 4px; background: #fafafa; cursor: pointer; }
      p.note { font-size: 0.8rem; color: #444; margin: 0.2rem 0; }
    `,
  ];

  protected willUpdate(changed: PropertyValues<this>): void {
    // A value from outside (undo, import, demo) replaces whatever was being typed: its problems go.
    const v = this.value;
    const s = this.lastSent;
    const outside = !!v && (!s || v.survey !== s.survey || v.surveys !== s.surveys || v.zBins !== s.zBins);
    if (changed.has('value') && outside && hasProblems(this.problems)) {
      this.problems = {};
      this.tell();
    }
  }

  private tell(): void {
    tellValidity(this, 'survey', this.problems);
  }

  private setProblem(field: string, message: string): void {
    const next = withProblem(this.problems, field, message);
    if (next === this.problems) return;
    this.problems = next;
    this.tell();
  }

  private send(next: SurveyChoices): void {
    this.lastSent = next;
    this.dispatchEvent(new CustomEvent('survey-change', { detail: next, bubbles: true, composed: true }));
  }

  /** A survey with one field changed from text, or the problem with it. */
  private changed(s: Survey, key: SurveyKey, raw: string, where: string, others: readonly Survey[]): Survey | string {
    let next: Survey;
    if (key === 'name') next = { ...s, name: raw.trim() };
    else {
      if (!isStrictNumber(raw.trim())) return `${where} ${key === 'areaArcmin2' ? 'area' : key === 'zMin' ? 'z min' : 'z max'}: "${raw}" is not a number`;
      next = { ...s, [key]: Number(raw.trim()) };
    }
    const e = validateSurvey(next, where);
    if (e.length) return e.join('; ');
    if (others.some((o) => o.name === next.name)) return `${where}: the name "${next.name}" is taken`;
    return next;
  }

  private editDefault(key: SurveyKey, raw: string): void {
    const v = this.value!;
    const r = this.changed(v.survey, key, raw, 'survey', []);
    if (typeof r === 'string') return this.setProblem(`survey.${key}`, r);
    this.clearGroup('survey.');
    this.send({ ...v, survey: r });
  }

  private clearGroup(prefix: string): void {
    const keep = Object.fromEntries(Object.entries(this.problems).filter(([k]) => !k.startsWith(prefix)));
    if (Object.keys(keep).length !== Object.keys(this.problems).length) {
      this.problems = keep;
      this.tell();
    }
  }

  private editNamed(i: number, key: SurveyKey, raw: string): void {
    const v = this.value!;
    const others = v.surveys.filter((_, j) => j !== i);
    const r = this.changed(v.surveys[i], key, raw, `survey ${i + 1}`, others);
    if (typeof r === 'string') return this.setProblem(`surveys.${i}.${key}`, r);
    this.clearGroup(`surveys.${i}.`);
    this.send({ ...v, surveys: v.surveys.map((s, j) => (j === i ? r : s)) });
  }

  private addNamed(): void {
    const v = this.value!;
    let k = v.surveys.length + 1;
    while (v.surveys.some((s) => s.name === `field-${k}`)) k++;
    this.send({ ...v, surveys: [...v.surveys, { name: `field-${k}`, areaArcmin2: v.survey.areaArcmin2, zMin: v.survey.zMin, zMax: v.survey.zMax }] });
  }

  private deleteNamed(i: number): void {
    const v = this.value!;
    this.clearGroup('surveys.');
    this.send({ ...v, surveys: v.surveys.filter((_, j) => j !== i) });
  }

  private editBin(i: number, end: 0 | 1, raw: string): void {
    const v = this.value!;
    const key = `zBins.${i}`;
    const text = raw.trim();
    if (!isStrictNumber(text)) return this.setProblem(key, `bin ${i + 1}: "${raw}" is not a number`);
    const b: [number, number] = [v.zBins[i][0], v.zBins[i][1]];
    b[end] = Number(text);
    if (!(b[0] >= 0 && b[1] > b[0] && b[1] <= 30)) return this.setProblem(key, `bin ${i + 1}: needs 0 ≤ z_lo < z_hi ≤ 30 (got ${b[0]}, ${b[1]})`);
    this.clearGroup(key);
    this.send({ ...v, zBins: v.zBins.map((x, j) => (j === i ? b : x)) });
  }

  private addBin(): void {
    const v = this.value!;
    const last = v.zBins[v.zBins.length - 1];
    const lo = last ? last[1] : v.survey.zMin;
    const hi = Math.min(30, lo + (last ? last[1] - last[0] : Math.max(0.5, (v.survey.zMax - v.survey.zMin) / 2)));
    if (!(hi > lo)) return this.setProblem('zBins.add', 'no room for another bin below z = 30');
    this.clearGroup('zBins.add');
    this.send({ ...v, zBins: [...v.zBins, [lo, hi]] });
  }

  private deleteBin(i: number): void {
    const v = this.value!;
    this.clearGroup('zBins.');
    this.send({ ...v, zBins: v.zBins.filter((_, j) => j !== i) });
  }

  private err(k: string) {
    return this.problems[k] ? html`<span class="err" role="alert">${this.problems[k]}</span>` : nothing;
  }

  private shown(s: Survey, key: SurveyKey): string {
    return key === 'name' ? s.name : shortNumber(s[key]);
  }

  render() {
    const v = this.value;
    if (!v) return nothing;
    const inv = (k: string) => (this.problems[k] ? 'true' : 'false');
    return html`
      <fieldset>
        <legend>Default survey</legend>
        <div class="fields">
          ${SURVEY_FIELDS.map(
            (f) => html`<label data-help=${`${f.label}: ${f.doc}`}>${f.label}<input
                type=${f.key === 'name' ? 'text' : 'text'}
                inputmode=${f.key === 'name' ? 'text' : 'decimal'}
                aria-label=${`survey ${f.label}`}
                aria-describedby=${`d-${f.key}`}
                aria-invalid=${inv(`survey.${f.key}`)}
                .value=${this.problems[`survey.${f.key}`] ? noChange : fieldValue(this.shown(v.survey, f.key))}
                data-v=${this.shown(v.survey, f.key)}
                @change=${(e: Event) => this.editDefault(f.key, (e.target as HTMLInputElement).value)}
              />${described(`d-${f.key}`, f.doc)}</label>`,
          )}
        </div>
        ${SURVEY_FIELDS.map((f) => this.err(`survey.${f.key}`))}
        ${this.help.line()}
      </fieldset>
      <fieldset>
        <legend>Named surveys</legend>
        <p class="note">Rows whose <code>survey</code> cell names one of these are audited in its volume; other rows in the survey above.</p>
        ${v.surveys.length
          ? html`<div class="list"><table>
              <thead><tr><th scope="col">name</th><th scope="col">area [arcmin²]</th><th scope="col">z min</th><th scope="col">z max</th><th scope="col"><span hidden>delete</span></th></tr></thead>
              <tbody>
                ${v.surveys.map(
                  (s, i) => html`<tr>
                    ${SURVEY_FIELDS.map(
                      (f) => html`<td><input
                          aria-label=${`survey ${i + 1} ${f.label}`}
                          aria-invalid=${inv(`surveys.${i}.${f.key}`)}
                          data-help=${`${f.label}: ${f.doc}`}
                          .value=${this.problems[`surveys.${i}.${f.key}`] ? noChange : fieldValue(this.shown(s, f.key))}
                          data-v=${this.shown(s, f.key)}
                          @change=${(e: Event) => this.editNamed(i, f.key, (e.target as HTMLInputElement).value)}
                        /></td>`,
                    )}
                    <td><button type="button" aria-label=${`delete survey ${s.name}`} @click=${() => this.deleteNamed(i)}>✕</button></td>
                  </tr>`,
                )}
              </tbody>
            </table></div>`
          : nothing}
        ${Object.keys(this.problems).filter((k) => k.startsWith('surveys.')).map((k) => this.err(k))}
        <button type="button" @click=${this.addNamed}>Add survey</button>
      </fieldset>
      <fieldset>
        <legend>Redshift bins</legend>
        <p class="note">Bins for the sample's number and mass densities; none = the survey's range${v.zBins.length ? '' : ` (${v.survey.zMin} < z < ${v.survey.zMax})`}.</p>
        ${v.zBins.map(
          (b, i) => html`<div>
            <label>bin ${i + 1} z from<input aria-label=${`bin ${i + 1} z from`} aria-invalid=${inv(`zBins.${i}`)} data-help="lower edge of the bin (0 ≤ z_lo < z_hi ≤ 30)" .value=${this.problems[`zBins.${i}`] ? noChange : fieldValue(shortNumber(b[0]))} data-v=${shortNumber(b[0])} @change=${(e: Event) => this.editBin(i, 0, (e.target as HTMLInputElement).value)} /></label>
            <label>to<input aria-label=${`bin ${i + 1} z to`} aria-invalid=${inv(`zBins.${i}`)} data-help="upper edge of the bin (0 ≤ z_lo < z_hi ≤ 30)" .value=${this.problems[`zBins.${i}`] ? noChange : fieldValue(shortNumber(b[1]))} data-v=${shortNumber(b[1])} @change=${(e: Event) => this.editBin(i, 1, (e.target as HTMLInputElement).value)} /></label>
            <button type="button" aria-label=${`delete bin ${i + 1}`} @click=${() => this.deleteBin(i)}>✕</button>
            ${this.err(`zBins.${i}`)}
          </div>`,
        )}
        ${this.err('zBins.add')}
        <button type="button" @click=${this.addBin}>Add bin</button>
      </fieldset>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'survey-editor': SurveyEditor;
  }
}
