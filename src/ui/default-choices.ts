import type { AuditChoices } from '../core/audit/choices.js';
import { PLANCK18 } from '../core/cosmology/presets.js';
import { DEMO_SURVEY } from '../demo/demo-sample.js';

/** The page's starting choices: the demo field, Planck 2018, Sheth–Tormen, EH98, 2000 draws (a fast first view; raise it for final numbers). */
export const DEFAULT_CHOICES: AuditChoices = Object.freeze({
  cosmology: PLANCK18,
  massFunction: 'sheth-tormen',
  transfer: { kind: 'eh98' },
  deltaC: { kind: 'constant', value: 1.686 },
  imfs: ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat', 'top-heavy-cmb'],
  sfh: 'constant',
  metallicity: 0.02,
  epsRef: 0.3,
  quantile: 0.997,
  draws: 2000,
  seed: 1,
  sliceDz: 1,
  formationZ: 30,
  survey: DEMO_SURVEY,
  surveys: [],
  zBins: [],
}) as AuditChoices;
