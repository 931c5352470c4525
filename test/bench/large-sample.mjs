// An invented survey-sized sample for the benchmarks and the large-sample browser tests: `rows` rows
// with the columns id,z,z_lo,z_hi,muv,mag_err, z spread over 7.2–10.8 and M_UV over −22.5…−18.5, from a
// fixed linear-congruential sequence (the same file every time). No real objects.
export function largeSampleCsv(rows) {
  let s = 12345;
  const u = () => {
    s = (Math.imul(s, 1103515245) + 12345) >>> 0;
    return s / 4294967296;
  };
  const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
  for (let i = 0; i < rows; i++) {
    const z = 7.2 + 3.6 * u();
    const dz = 0.05 + 0.25 * u();
    lines.push(`SYN-${String(i + 1).padStart(5, '0')},${z.toFixed(3)},${(z - dz).toFixed(3)},${(z + dz).toFixed(3)},${(-22.5 + 4 * u()).toFixed(2)},${(0.05 + 0.15 * u()).toFixed(3)}`);
  }
  return lines.join('\n') + '\n';
}
