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
