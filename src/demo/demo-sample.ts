/**
 * The embedded demo: an invented deep field ("Quillfield Deep", 40 arcmin², 7 < z < 11) and eight
 * invented candidate galaxies. None of these are real objects or real measurements; the numbers were
 * chosen to exercise every verdict and attribution of the audit.
 */
export const DEMO_SURVEY = Object.freeze({ name: 'quillfield-deep', areaArcmin2: 40, zMin: 7, zMax: 11 });

export const DEMO_SAMPLE_CSV = `id,z,z_lo,z_hi,z_alt,p_alt,muv,m_ab,lambda_obs_um,log_mstar,imf_ref,log_mstar_err,log_mstar_alt,mag_err,beta,notes
QF-101,7.42,7.30,7.55,,,-19.6,,,,,,,0.10,-2.2,faint compact source
QF-214,8.21,8.05,8.40,,,,26.9,1.50,,,,,0.12,-2.1,clean dropout
QF-322,9.63,9.40,9.85,,,,,,11.6,salpeter,0.25,,,,red and very massive
QF-407,10.30,10.05,10.55,,,-22.6,,,,,,,0.08,-2.3,bright blue source
QF-518,8.90,8.70,9.10,2.40,0.40,,,,11.0,salpeter,0.30,10.1,,,possible dusty interloper
QF-630,7.10,6.98,7.22,,,,,,11.15,chabrier,0.20,,,,massive but old
QF-745,10.80,10.50,11.10,,,,27.8,2.00,,,,,0.15,-2.0,
QF-853,9.12,8.95,9.30,,,-20.8,,,,,,,0.10,-1.6,dusty
`;
