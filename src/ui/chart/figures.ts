import type { AuditResult, CeilingCurves, GalaxyPoints } from '../../core/audit/index.js';
import { PRESETS } from '../../core/cosmology/presets.js';
import { citeCosmology, citeImf, citeMassFunction, citeTransfer } from '../citations.js';
import { DASH, imfStyle, massFunctionStyle, OKABE_ITO } from '../palette.js';
import type { ChartModel, MarkerSet } from './chart-config.js';
import { legibility } from './legibility.js';

/** "the Eisenstein & Hu (1998) transfer function", or a tabulated / power-law P(k) named as such. */
function transferPhrase(kind: string): string {
  return kind === 'table' || kind === 'power-law' ? citeTransfer(kind) : `the ${citeTransfer(kind)} transfer function`;
}

/** The assumptions behind every audit figure, with the methods cited as a paper would. */
export function assumptions(r: AuditResult): string {
  const c = r.record.choices;
  const p = c.cosmology;
  return (
    `Halo mass function of ${citeMassFunction(c.massFunction)}, linear P(k) from ${transferPhrase(c.transfer.kind)}, ${citeCosmology(p, PRESETS)} (H0 = ${p.h0}, Ωm = ${p.omegaM}, σ8 = ${p.sigma8}); ` +
    `survey ${c.survey.areaArcmin2} arcmin², ${c.survey.zMin} < z < ${c.survey.zMax}; slices Δz = ${c.sliceDz}; SFH ${c.sfh}; ${c.draws} draws, seed ${c.seed}. ` +
    'Results depend on the assumed stellar population and redshifts.'
  );
}

/** "IMFs: Salpeter (1955) ●, Kroupa (2001) ▲ …" in the order given. */
const imfList = (imfs: readonly string[]): string => `IMFs: ${imfs.map(citeImf).join('; ')}.`;

/** 1 for each id whose headline verdict is strained or over budget. */
function tensionOf(r: AuditResult, ids: readonly string[]): Uint8Array {
  const v = new Map(r.galaxies.map((g) => [g.id, g.verdict]));
  return Uint8Array.from(ids, (id) => (v.get(id) === 'strained' || v.get(id) === 'over budget' ? 1 : 0));
}

/** Figure 1: stellar mass against redshift, with the ΛCDM ceilings of this survey's slices. */
export function massRedshiftFigure(r: AuditResult, curves: CeilingCurves, points: GalaxyPoints[]): ChartModel {
  const c = r.record.choices;
  const n = curves.z.length;
  const lineData = [Array.from(curves.log10MstarEps1), Array.from(curves.log10MstarEpsRef), Array.from(curves.log10MstarEps1Q16), Array.from(curves.log10MstarEps1Q84)];
  const markers: MarkerSet[] = points.map((p, i) => {
    const s = imfStyle(p.imf);
    const jitter = (i - (points.length - 1) / 2) * 0.04;
    return { label: p.imf, color: s.color, shape: s.shape, x: Array.from(p.z, (z) => z + jitter), y: p.log10M, yLo: p.log10MLo, yHi: p.log10MHi, ids: p.ids, tension: tensionOf(r, p.ids) };
  });
  const shown = n ? markers : [];
  const leg = legibility(shown);
  return {
    id: 'mass-redshift',
    title: 'Stellar mass against the ΛCDM ceiling',
    xLabel: 'redshift z',
    yLabel: 'log10 M* [Msun]',
    caption:
      `Galaxies (median and 16–84% of the Monte Carlo) under each IMF, shifted slightly in z per IMF to stay apart; lines: ε f_b M_halo of the most massive halo at the ${(c.quantile * 100).toFixed(1)}% quantile in each Δz = ${c.sliceDz} slice, for ε = 1 (solid) and ε = ${c.epsRef} (dashed); ` +
      `shaded between dotted lines: 16–84% of the most massive halo, ε = 1. ${imfList(points.map((p) => p.imf))} ${leg.note ? leg.note + ' ' : ''}${assumptions(r)}`,
    x: curves.z,
    lines: [
      { label: `ceiling ε = 1 (q = ${c.quantile})`, color: OKABE_ITO.black, width: 2 },
      { label: `ceiling ε = ${c.epsRef}`, color: OKABE_ITO.black, dash: DASH.dashed },
      { label: 'most massive halo, 16–84%', color: '#777777', dash: DASH.dotted },
      { label: 'most massive halo 84%', color: '#777777', dash: DASH.dotted, noLegend: true },
    ],
    lineData,
    bands: [[2, 3]],
    markers: shown,
    points: leg.points,
    density: leg.density,
  };
}

/** Figure 2: cumulative stellar mass density of the sample against the ΛCDM limits (first bin). */
export function densityFigure(r: AuditResult): ChartModel {
  const c = r.record.choices;
  const bin = r.sample.bins[0];
  const pts = bin ? [...bin.points].sort((a, b) => a.log_mstar - b.log_mstar) : [];
  const x = Float64Array.from(pts, (p) => p.log_mstar);
  const log = (v: number): number => Math.log10(Math.max(v, 1e-300));
  const ids = pts.map((p) => p.id);
  const markers: MarkerSet[] = [
    {
      label: 'sample',
      color: OKABE_ITO.black,
      shape: 'circle',
      x,
      y: pts.map((p) => log(p.rho_above_msun_mpc3)),
      yLo: pts.map((p) => log(p.rho_above_lo_msun_mpc3)),
      yHi: pts.map((p) => log(p.rho_above_hi_msun_mpc3)),
      ids,
      tension: tensionOf(r, ids),
    },
  ];
  const leg = legibility(markers);
  return {
    id: 'density',
    title: 'Cumulative stellar mass density of the sample',
    xLabel: 'log10 M* threshold [Msun]',
    yLabel: 'log10 ρ*(>M*) [Msun Mpc⁻³]',
    caption: bin
      ? `Sample in ${bin.z_min} < z < ${bin.z_max} (${bin.volume_mpc3.toExponential(2)} Mpc³), each galaxy under its headline IMF: ρ*(>M*) with its 16–84% mass range; lines: ε f_b ρ_m(>M*/(ε f_b)) for ε = 1 (solid) and ε = ${c.epsRef} (dashed). The sample needs ε ≥ ${bin.eps_required_rho.toPrecision(2)}. ${leg.note ? leg.note + ' ' : ''}${assumptions(r)}`
      : 'No redshift bin.',
    x,
    lines: [
      { label: 'ΛCDM limit ε = 1', color: OKABE_ITO.black, width: 2 },
      { label: `ΛCDM limit ε = ${c.epsRef}`, color: OKABE_ITO.black, dash: DASH.dashed },
    ],
    lineData: [pts.map((p) => log(p.rho_limit_eps1_msun_mpc3)), pts.map((p) => log(p.rho_limit_eps_ref_msun_mpc3))],
    markers,
    points: leg.points,
    density: leg.density,
  };
}

/** Figure 3: one galaxy under every IMF, side by side, against its ceiling. */
export function galaxyImfFigure(r: AuditResult, id: string): ChartModel {
  const c = r.record.choices;
  const g = r.galaxies.find((x) => x.id === id && x.status === 'ok') ?? r.galaxies.find((x) => x.status === 'ok');
  const imfs = g?.imf ? Object.keys(g.imf) : [];
  const x = Float64Array.from(imfs, (_, i) => i + 1);
  const ceil = g ? Math.log10(g.ceiling!.stellar_ceiling_msun) : 0;
  const inTension = g?.verdict === 'strained' || g?.verdict === 'over budget' ? 1 : 0;
  return {
    id: 'galaxy-imfs',
    title: g ? `${g.id} (z = ${g.input.z}) under every IMF` : 'no galaxy audited',
    xLabel: 'IMF',
    yLabel: 'log10 M* [Msun]',
    caption: g
      ? `${g.id}: median log M* and 16–84% under each IMF (headline IMF ${g.headline_imf}: ${g.verdict}); solid: f_b M_halo of the most massive halo at the ${(c.quantile * 100).toFixed(1)}% quantile in ${g.ceiling!.slice_z_min.toFixed(2)} < z < ${g.ceiling!.slice_z_max.toFixed(2)} (ε = 1); dashed: ε = ${c.epsRef}. ${imfList(imfs)} ${assumptions(r)}`
      : '',
    x,
    xCategories: imfs,
    lines: [
      { label: 'ceiling ε = 1', color: OKABE_ITO.black, width: 2 },
      { label: `ceiling ε = ${c.epsRef}`, color: OKABE_ITO.black, dash: DASH.dashed },
    ],
    lineData: [imfs.map(() => ceil), imfs.map(() => ceil + Math.log10(c.epsRef))],
    markers: imfs.map((imf, i) => {
      const s = imfStyle(imf);
      const v = g!.imf![imf];
      return { label: imf, color: s.color, shape: s.shape, x: [i + 1], y: [v.log_mstar_median], yLo: [v.log_mstar_p16], yHi: [v.log_mstar_p84], ids: [g!.id], tension: Uint8Array.of(inTension) };
    }),
  };
}

/** Figure 4: halo abundance n(>M) at one redshift for every mass function. */
export function explorerFigure(log10M: Float64Array, series: { name: string; label: string; log10N: Float64Array }[], z: number, cosmoText: string, transferKind?: string): ChartModel {
  return {
    id: 'explorer',
    title: `Halo abundance at z = ${z}`,
    xLabel: 'log10 M [Msun]',
    yLabel: 'log10 n(>M) [comoving Mpc⁻³]',
    caption: `Cumulative halo number density at z = ${z} for the mass functions of ${series.map((s) => citeMassFunction(s.name)).join(', ')}${transferKind ? `, with linear P(k) from ${transferPhrase(transferKind)}` : ''} (${cosmoText}).`,
    x: log10M,
    lines: series.map((s) => {
      const st = massFunctionStyle(s.name);
      return { label: citeMassFunction(s.name), color: st.color, dash: st.dash };
    }),
    lineData: series.map((s) => Array.from(s.log10N, (v) => (v < -30 ? null : v))),
    markers: [],
  };
}
