import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

const invBw = 1 / C.boardWidthM;

/**
 * Bilinear lookup in a pattern-board × foot grid (41 columns, board b at column b, rows every `1/invRowM` metres
 * from the foul line) at lane position (x, y) in metres; positions outside the grid read its edge.
 *
 * Source: bilinear interpolation (common practice). Units: m in, the grid's unit out. Edge cases: the grid must
 * have at least 2 rows and 2 columns (the friction fields' are); internal to the motion model, unchecked (hot path).
 * Example: on a grid of 0 µm in row 0 and 10 µm in row 1, one row per foot, `bilinear(g, 2, 41, 1/0.3048, 0.1524, 0)` → 5.
 */
export function bilinear(grid: Float64Array, rows: number, cols: number, invRowM: number, x: number, y: number): number {
  let jf = y * invBw + 20;
  if (jf < 0) jf = 0;
  else if (jf > cols - 1) jf = cols - 1;
  let rf = x * invRowM;
  if (rf < 0) rf = 0;
  else if (rf > rows - 1) rf = rows - 1;
  let j0 = Math.floor(jf),
    r0 = Math.floor(rf);
  if (j0 > cols - 2) j0 = cols - 2;
  if (r0 > rows - 2) r0 = rows - 2;
  const fj = jf - j0,
    fr = rf - r0;
  const a = r0 * cols + j0,
    b = a + cols;
  return (1 - fr) * ((1 - fj) * grid[a] + fj * grid[a + 1]) + fr * ((1 - fj) * grid[b] + fj * grid[b + 1]);
}
