/** "1–12, 15, 17–18" from [1..12, 15, 17, 18]. */
export function laneRanges(lanes: number[]): string {
  const sorted = [...new Set(lanes)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    parts.push(i === j ? `${sorted[i]}` : `${sorted[i]}–${sorted[j]}`);
    i = j + 1;
  }
  return parts.join(', ');
}
