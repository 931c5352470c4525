#!/usr/bin/env python3
"""The audit's per-draw work as a single-threaded vectorised numpy script, for side-by-side timing.

Usage: numpy_audit.py INPUTS.json OUT.json   (INPUTS from test/bench/numpy-inputs.ts)

Per galaxy and draw, as the tool does (src/core/audit/galaxy-draws.ts, imf-statistics.ts,
galaxy-audit.ts): split-normal redshift, log-uniform age from 1 Myr to t(z), magnitude error,
L_nu from the apparent magnitude and D_L, dust A(beta) carried to the rest wavelength (Meurer et al.
1999 eq. 11 with the Calzetti et al. 2000 eq. 4 curve), the grid position in the M/L tables, the
ceilings log10 f_b M_q(z) without and with cosmic variance, the baryons accreted during the
population's age (FMBK10 mean history, y = (M/1e12)^-0.1 linear in G(u)); then per IMF the bilinear
M/L lookup, log M*, eps_req, P(over), P(strained), P(over | cosmological offset), the time-budget
ratio, and the type-7 percentiles (numpy's default 'linear' method). The tables are the tool's own,
so both sides differ only in how they compute. Its random numbers are numpy's (PCG64), not the
tool's, so medians agree to Monte Carlo noise only. Left out (the tool does them, numpy does not):
the exact Eddington posterior, the fixed-redshift checks and the what-it-would-take search. Prints
the wall time of the audit loop (reading the JSON excluded).
"""
import json
import sys
import time

import numpy as np

LN10 = np.log(10.0)


def calzetti_k(lam):
    """Calzetti et al. 2000, ApJ 533, 682, eq. 4, R'_V = 4.05, lambda in um."""
    blue = 2.659 * (-2.156 + 1.509 / lam - 0.198 / lam**2 + 0.011 / lam**3) + 4.05
    red = 2.659 * (-1.857 + 1.040 / lam) + 4.05
    return np.where(lam < 0.63, blue, red)


def main():
    inp = json.load(open(sys.argv[1]))
    n = inp['draws']
    bg = inp['bg']
    xs = bg['x0'] + bg['h'] * np.arange(len(bg['ln_dl']))
    ln_dl = np.array(bg['ln_dl'])
    ln_age = np.array(bg['ln_age'])
    ln_age_rev = ln_age[::-1].copy()
    xs_rev = xs[::-1].copy()
    ln_t_form = np.log(bg['age_form_gyr'])
    cz = np.array(inp['ceiling']['z'])
    cm = np.array(inp['ceiling']['log10_m'])
    cvs = {float(k): np.array(v) for k, v in inp['ceiling']['cv'].items()}
    acc_u = np.array(inp['accretion']['u'])
    acc_g = np.array(inp['accretion']['g'])
    k_acc = inp['accretion']['k']
    lfb = inp['log10_fb']
    eps_ref = inp['eps_ref']
    lref = np.log10(eps_ref)
    imfs = inp['imfs']
    tabs = {}
    for imf in imfs:
        t = inp['tables'][imf]
        tabs[imf] = (np.array(t['log_lnu']), np.array(t['log_surv']))
    t0 = inp['tables'][imfs[0]]
    n_age, n_lam = t0['n_age'], t0['n_lam']
    fa = (n_age - 1) / (t0['log10_age_max'] - t0['log10_age_min'])
    fl = (n_lam - 1) / (t0['log10_lam_max'] - t0['log10_lam_min'])
    k1600 = calzetti_k(np.array(0.16))
    out = []
    start = time.perf_counter()
    for gi, g in enumerate(inp['galaxies']):
        rng = np.random.default_rng(gi + 1)
        gz = rng.standard_normal(n)
        u_age = rng.random(n)
        g_mag = rng.standard_normal(n)
        off = g['cosmo_sd_dex'] * rng.standard_normal(n)
        zk = np.maximum(g['z'] + gz * np.where(gz < 0, g['s_lo'], g['s_hi']), 0.05)
        x = np.log1p(zk)
        rest = g['lambda_obs_um'] / (1 + zk)
        ok = (rest >= inp['lyman_alpha_um']) & (rest <= inp['model_lambda_max_um'])
        zk, x, rest, u_age, g_mag, off = zk[ok], x[ok], rest[ok], u_age[ok], g_mag[ok], off[ok]
        la_max = np.interp(x, xs, ln_age)
        log10_age = u_age * (la_max / LN10 + 3)
        l = inp['lnu_const'] + (2 * np.interp(x, xs, ln_dl) - x) / LN10 - 0.4 * (g['m_app'] + g_mag * g['mag_err'])
        l += 0.4 * max(0.0, 4.43 + 1.99 * g['beta']) * calzetti_k(rest) / k1600
        gx = np.clip((log10_age - t0['log10_age_min']) * fa, 0, n_age - 1)
        gy = np.clip((np.log10(g['lambda_obs_um']) - x / LN10 - t0['log10_lam_min']) * fl, 0, n_lam - 1)
        i = np.minimum(gx.astype(np.int64), n_age - 2)
        j = np.minimum(gy.astype(np.int64), n_lam - 2)
        tx = gx - i
        ty = gy - j
        w00 = (1 - tx) * (1 - ty)
        w01 = (1 - tx) * ty
        w10 = tx * (1 - ty)
        w11 = tx * ty
        c00 = i * n_lam + j
        log_ceil = lfb + np.interp(zk, cz, cm)
        log_ceil_cv = lfb + np.interp(zk, cz, cvs[g['sigma_dm']])
        # time budget: baryons accreted by the ceiling halo over [max(t - age, t_form), t]
        ln_t = la_max
        t_obs = np.exp(ln_t)
        t_start = np.maximum(t_obs - 10**log10_age / 1000, np.exp(ln_t_form))
        has = t_start < t_obs
        x_start = np.interp(np.log(t_start), ln_age_rev, xs_rev)
        m0 = 10 ** (log_ceil - lfb)
        y0 = (m0 / 1e12) ** -0.1
        y = y0 + k_acc * (np.interp(x_start, acc_u, acc_g) - np.interp(x, acc_u, acc_g))
        acc = np.where(has, lfb + np.log10(-m0 * np.expm1(-10 * np.log(y / y0))), -np.inf)
        res = {'id': g['id'], 'draws_used': int(ok.sum()), 'imf': {}}
        for imf in imfs:
            lnu_tab, surv_tab = tabs[imf]
            ml = surv_tab[i] * (1 - tx) + surv_tab[i + 1] * tx - (w00 * lnu_tab[c00] + w01 * lnu_tab[c00 + 1] + w10 * lnu_tab[c00 + n_lam] + w11 * lnu_tab[c00 + n_lam + 1])
            lm = l + ml
            leps = lm - log_ceil
            leps_cv = lm - log_ceil_cv
            formed = lm - (surv_tab[i] * (1 - tx) + surv_tab[i + 1] * tx)
            ratio = formed - acc
            m16, m50, m84 = np.percentile(lm, [16, 50, 84])
            e05, e50, e95 = np.percentile(leps, [5, 50, 95])
            r = {
                'log_mstar_median': m50, 'log_mstar_p16': m16, 'log_mstar_p84': m84,
                'eps_required_median': 10**e50, 'eps_required_p05': 10**e05, 'eps_required_p95': 10**e95,
                'eps_required_median_cv': 10 ** np.median(leps_cv),
                'p_over_budget': float(np.mean(leps > 0)), 'p_strained': float(np.mean(leps > lref)),
                'p_over_budget_cosmo': float(np.mean(leps > off)),
                'time_budget_ratio_median': 10 ** np.median(ratio), 'p_time_budget_over': float(np.mean(ratio > 0)),
            }
            if imf == inp['headline']:
                r['formed_mass_median_msun'] = 10 ** np.median(formed)
            res['imf'][imf] = r
        out.append(res)
    wall = time.perf_counter() - start
    json.dump({'wall_s': wall, 'numpy': np.__version__, 'galaxies': out}, open(sys.argv[2], 'w'))
    print(f'numpy {np.__version__}: {len(out)} galaxies x {n} draws x {len(imfs)} IMFs in {wall:.2f} s (one thread)')


if __name__ == '__main__':
    main()
