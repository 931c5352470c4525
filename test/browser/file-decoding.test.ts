import { expect } from 'chai';
import '../../src/ui/sample-editor.js';

/**
 * <sample-editor> reads an imported file as the command line does (the core's decodeText): UTF-16 with a
 * byte-order mark is read, Latin-1 bytes are refused with the file named and the byte located. Invented ids.
 */
function utf16le(text: string): Uint8Array {
  const out = new Uint8Array(2 + 2 * text.length);
  out.set([0xff, 0xfe]);
  for (let i = 0; i < text.length; i++) {
    out[2 + 2 * i] = text.charCodeAt(i) & 0xff;
    out[3 + 2 * i] = text.charCodeAt(i) >> 8;
  }
  return out;
}

/** Imports the bytes as a file; `csv` is the sample-change's CSV, or undefined if none came within waitMs. */
async function importInto(bytes: Uint8Array, name: string, waitMs: number): Promise<{ el: HTMLElement; csv?: string }> {
  const el = document.createElement('sample-editor') as HTMLElement & { updateComplete: Promise<boolean>; csv: string };
  el.csv = 'id,z,muv\n';
  document.body.append(el);
  await el.updateComplete;
  const changed = new Promise<string>((ok) => el.addEventListener('sample-change', (e) => ok((e as CustomEvent).detail.csv), { once: true }));
  const input = el.shadowRoot!.querySelector('input[type=file]') as HTMLInputElement;
  const dt = new DataTransfer();
  dt.items.add(new File([bytes as Uint8Array<ArrayBuffer>], name, { type: 'text/csv' }));
  input.files = dt.files;
  input.dispatchEvent(new Event('change'));
  const csv = await Promise.race([changed, new Promise<undefined>((ok) => setTimeout(() => ok(undefined), waitMs))]);
  await el.updateComplete;
  return { el, csv };
}

describe('<sample-editor> file encodings', () => {
  it('reads UTF-16LE with a BOM, non-ASCII ids intact', async () => {
    const { el, csv } = await importInto(utf16le('id,z,muv\r\nΩ-1,9.5,-21\r\nÅ-2,8.1,-20\r\n'), 'wide.csv', 20000); // the change comes as soon as the file is read
    expect(csv).to.contain('Ω-1');
    expect(csv).to.contain('Å-2');
    expect(csv!.charCodeAt(0)).to.not.equal(0xfeff);
    el.remove();
  });
  it('refuses Latin-1 bytes with the file and the offending byte named, and keeps the sample', async () => {
    const latin1 = Uint8Array.from([...'id,z,muv\nG'].map((c) => c.charCodeAt(0)).concat([0xe9, ...[...',9,-21\n'].map((c) => c.charCodeAt(0))]));
    const { el, csv } = await importInto(latin1, 'old.csv', 1500); // a refused file sends no change: wait a while for none
    expect(csv).to.equal(undefined);
    const msg = el.shadowRoot!.textContent!;
    expect(msg).to.contain('old.csv is not valid UTF-8');
    expect(msg).to.contain('0xe9');
    el.remove();
  });
});
