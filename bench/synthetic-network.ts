// A synthetic network of N segments on a grid, for benchmarks only (the
// numbers are invented, like the demo scenario).
export function syntheticCsv(n: number, withGeometry = true) {
  const cols = Math.ceil(Math.sqrt(n));
  const lines = [
    `segment_id,road_name,from_desc,to_desc,length_mi,width_ft,lanes,functional_class,surface,adt,truck_pct,pci,pci_date,last_treatment,last_treatment_year,district${withGeometry ? ',geometry' : ''}`,
  ];
  for (let i = 0; i < n; i++) {
    const x = i % cols;
    const y = Math.floor(i / cols);
    const lon = -99 + x * 0.0025;
    const lat = 38 + y * 0.0025;
    const pci = (i * 37) % 101;
    const cls = i % 17 === 0 ? 'major_collector' : 'local';
    const geom = withGeometry
      ? `,"LINESTRING (${lon.toFixed(5)} ${lat.toFixed(5)}, ${(lon + 0.002).toFixed(5)} ${lat.toFixed(5)})"`
      : '';
    lines.push(
      `SYN-${i},Grid Road ${y},Cross ${x},Cross ${x + 1},0.108,24,2,${cls},asphalt,${100 + (i % 900)},5,${pci},2026-06-01,thin overlay,${2005 + (i % 20)},D${y % 8}${geom}`,
    );
  }
  return `${lines.join('\n')}\n`;
}

/**
 * A body for POST /api/plan/optimize that HiGHS cannot close quickly: a multi-year multiple-choice
 * knapsack with random costs and benefits (seeded) and budgets for about half of the work. Short ids
 * keep 20,000 options under the 1 MB JSON limit.
 */
export function syntheticOptimizeBody(segments: number, optionsEach: number, years: number, timeLimitSeconds: number) {
  let a = 7;
  const u = () => {
    a = (a * 1103515245 + 12345) % 2147483648;
    return a / 2147483648;
  };
  const letters = 'abcdefghijklmnopqrstuvwxyz';
  return {
    method: 'exact' as const,
    timeLimitSeconds,
    budgets: new Array(years).fill(Math.round((segments * 5500) / years / 2)),
    segments: Array.from({ length: segments }, (_, i) => ({
      id: String(i),
      options: Array.from({ length: optionsEach }, (_, j) => ({
        id: letters[j % 26],
        year: Math.floor(u() * years),
        cost: Math.round(1000 + u() * 8999),
        benefit: Math.round(100 + u() * 899),
      })),
    })),
  };
}
