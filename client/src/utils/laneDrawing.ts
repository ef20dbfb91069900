import { line as d3line, scaleLinear, type ScaleQuantize, type Selection, select } from 'd3';
import {
  ARROW_BOARDS,
  ARROWS_FT,
  BOARD_COUNT,
  BOARD_WIDTH_IN,
  HEADPIN_FT,
  LANE_WIDTH_IN,
  POCKET_BOARD,
  type ShotPrediction,
} from '@engine/index';
import type { PatternDetail } from '@shared/patterns';

/** One ball's predicted path on the lane. */
export interface LanePath {
  key: string;
  label: string;
  colour: string;
  prediction: ShotPrediction;
  /** A what-if path: drawn dashed. */
  dashed?: boolean;
}

/** Prediction boards are counted from the bowler's hand-side gutter; the oil grid from the right-hand gutter. */
export type LaneHand = 'right' | 'left';

/* ---- geometry (USBC lane specifications and common practice): 39 boards of 41.5/39 in, arrows at 15 ft, dots at 7 ft, headpin at 60 ft -- */
export const DOTS_FT = 7;
const DOT_BOARDS = [3, 5, 8, 11, 14, 26, 29, 32, 35, 37];
const ROW_SPACING_FT = (12 * Math.sin(Math.PI / 3)) / 12;
/** Pin number → lateral offset (in, toward the right-hand side positive) and row (0 = headpin). */
const PINS: readonly { n: number; offsetIn: number; row: number }[] = [
  { n: 1, offsetIn: 0, row: 0 },
  { n: 2, offsetIn: -6, row: 1 },
  { n: 3, offsetIn: 6, row: 1 },
  { n: 4, offsetIn: -12, row: 2 },
  { n: 5, offsetIn: 0, row: 2 },
  { n: 6, offsetIn: 12, row: 2 },
  { n: 7, offsetIn: -18, row: 3 },
  { n: 8, offsetIn: -6, row: 3 },
  { n: 9, offsetIn: 6, row: 3 },
  { n: 10, offsetIn: 18, row: 3 },
];
const LANE_END_FT = 63;

export const LANE_VIEW_W = 300;
export const LANE_VIEW_H = 660;
const M = { top: 14, right: 12, bottom: 30, left: 44 };
const laneW = LANE_VIEW_W - M.left - M.right;
/** x of a position measured in boards from the right-hand gutter (board n's centre is at n − 0.5). */
const x = scaleLinear()
  .domain([0, BOARD_COUNT])
  .range([M.left + laneW, M.left]);
const y = scaleLinear()
  .domain([0, LANE_END_FT])
  .range([LANE_VIEW_H - M.bottom, M.top]);
const pxPerInAcross = laneW / LANE_WIDTH_IN;
const pxPerInAlong = (y(0) - y(1)) / 12;
/** How much the width is stretched against the length so the boards can be read. */
export const LANE_STRETCH = Math.round(pxPerInAcross / pxPerInAlong);

/** A hand-side board of a prediction → boards from the right-hand gutter. */
function physical(hand: LaneHand, board: number): number {
  return hand === 'right' ? board : BOARD_COUNT + 1 - board;
}

/** The oil scale's seven steps when the stylesheet's --lw-oil-1…7 cannot be read. */
export const OIL_FALLBACK = ['#d6e7f6', '#b0d0ee', '#7fb0e0', '#4f8cca', '#2b68ab', '#174884', '#0c2d5a'];

const PATHS_CLASS = 'matchup-lane-view__paths';

/** The whole lane's outline, from the foul line to the lane's end. */
function laneRect(root: Selection<SVGSVGElement, unknown, null, undefined>) {
  return root
    .append('rect')
    .attr('x', M.left)
    .attr('y', y(LANE_END_FT))
    .attr('width', laneW)
    .attr('height', y(0) - y(LANE_END_FT));
}

export interface LaneDrawing {
  grid: PatternDetail['grid'];
  hand: LaneHand;
  oilScale: ScaleQuantize<string>;
  /** A distance along the lane, in the bowler's units, as the axis prints it. */
  distanceText: (ft: number) => string;
}

/** The lane, its oil, marks, pins and axes (and an empty layer for the paths): the whole picture is redrawn. */
export function drawLane(svg: SVGSVGElement, d: LaneDrawing): void {
  const root = select(svg);
  root.selectAll('*').remove();

  // Lane surface and boards.
  laneRect(root).attr('fill', 'var(--lw-maple-200)');

  // Oil heat map: one cell per board per foot of the grid.
  const g = d.grid;
  const oil = root.append('g').attr('class', 'oil');
  const ftStep = g.ft.length > 1 ? g.ft[1] - g.ft[0] : 1;
  g.boards.forEach((board, i) => {
    g.ft.forEach((ft, j) => {
      const v = g.values[i]?.[j] ?? 0;
      if (v <= 0.01) return;
      oil
        .append('rect')
        .attr('x', x(board))
        .attr('y', y(ft + ftStep))
        .attr('width', x(board - 1) - x(board))
        .attr('height', y(ft) - y(ft + ftStep) + 0.3)
        .attr('fill', d.oilScale(v))
        .attr('fill-opacity', 0.85);
    });
  });

  const boards = root.append('g').attr('stroke', 'var(--lw-maple-500)').attr('stroke-opacity', 0.35).attr('stroke-width', 0.5);
  for (let b = 1; b < BOARD_COUNT; b++) boards.append('line').attr('x1', x(b)).attr('x2', x(b)).attr('y1', y(0)).attr('y2', y(LANE_END_FT));
  laneRect(root).attr('fill', 'none').attr('stroke', 'var(--lw-maple-700)');

  // Foul line, dots, arrows, headpin line.
  root
    .append('line')
    .attr('x1', M.left)
    .attr('x2', M.left + laneW)
    .attr('y1', y(0))
    .attr('y2', y(0))
    .attr('stroke', 'var(--lw-ink)')
    .attr('stroke-width', 2);
  const marks = root.append('g').attr('fill', 'var(--lw-maple-700)');
  for (const b of DOT_BOARDS)
    marks
      .append('circle')
      .attr('cx', x(b - 0.5))
      .attr('cy', y(DOTS_FT))
      .attr('r', 1.8);
  for (const b of ARROW_BOARDS) {
    const cx = x(b - 0.5);
    const tip = y(ARROWS_FT + 0.9);
    const base = y(ARROWS_FT);
    marks.append('path').attr('d', `M${cx},${tip} L${cx - 3},${base} L${cx + 3},${base} Z`);
  }

  // Pins: centre of the headpin on board 20 at 60 ft, 12 in apart in rows 10.39 in apart.
  const pins = root.append('g');
  for (const p of PINS) {
    const boardsFromRight = BOARD_COUNT / 2 + p.offsetIn / BOARD_WIDTH_IN;
    pins
      .append('circle')
      .attr('cx', x(boardsFromRight))
      .attr('cy', y(HEADPIN_FT + p.row * ROW_SPACING_FT))
      .attr('r', 3.4)
      .attr('fill', '#ffffff')
      .attr('stroke', 'var(--lw-ink)')
      .attr('stroke-width', 1);
  }
  // The pocket (board 17.5 for the hand in use) at the headpin.
  root
    .append('circle')
    .attr('cx', x(physical(d.hand, POCKET_BOARD) - 0.5))
    .attr('cy', y(HEADPIN_FT))
    .attr('r', 2.2)
    .attr('fill', 'var(--lw-amber-500)');

  // Axes: feet along the left edge, boards along the foul line.
  const axis = root.append('g').attr('font-size', 10).attr('fill', 'var(--lw-ink-muted)').attr('font-family', 'inherit');
  for (const ft of [0, 7, 15, 20, 30, 40, 50, 60]) {
    axis
      .append('text')
      .attr('x', M.left - 6)
      .attr('y', y(ft) + 3)
      .attr('text-anchor', 'end')
      .text(d.distanceText(ft));
    axis
      .append('line')
      .attr('x1', M.left - 3)
      .attr('x2', M.left)
      .attr('y1', y(ft))
      .attr('y2', y(ft))
      .attr('stroke', 'var(--lw-ink-muted)');
  }
  for (const b of [1, 5, 10, 15, 20, 25, 30, 35, 39]) {
    axis
      .append('text')
      .attr('x', x(b - 0.5))
      .attr('y', y(0) + 14)
      .attr('text-anchor', 'middle')
      .text(String(physical(d.hand, b)));
  }
  axis
    .append('text')
    .attr('x', M.left + laneW / 2)
    .attr('y', y(0) + 26)
    .attr('text-anchor', 'middle')
    .text(`boards from the ${d.hand}-hand gutter · foul line`);

  root.append('g').attr('class', PATHS_CLASS);
}

/** The predicted paths and their breakpoints, on top of a drawn lane: redrawn alone when the paths change (a what-if). */
export function drawPaths(svg: SVGSVGElement, hand: LaneHand, list: readonly LanePath[]): void {
  const root = select(svg).select<SVGGElement>(`g.${PATHS_CLASS}`);
  if (root.empty()) return;
  root.selectAll('*').remove();
  // Paths, then breakpoints on top.
  const toXY = d3line<{ ft: number; board: number }>()
    .x((d) => x(physical(hand, d.board) - 0.5))
    .y((d) => y(d.ft));
  const paths = root.append('g').attr('fill', 'none');
  for (const p of list) {
    paths
      .append('path')
      .attr('d', toXY(p.prediction.path) ?? '')
      .attr('stroke', p.colour)
      .attr('stroke-width', p.dashed ? 2.2 : 2.6)
      .attr('stroke-dasharray', p.dashed ? '6 4' : null)
      .attr('stroke-linecap', 'round')
      .attr('data-ball', p.key);
  }
  const bps = root.append('g');
  for (const p of list) {
    const bp = p.prediction.breakpoint;
    bps
      .append('rect')
      .attr('x', x(physical(hand, bp.board) - 0.5) - 4)
      .attr('y', y(bp.ft) - 4)
      .attr('width', 8)
      .attr('height', 8)
      .attr('transform', `rotate(45 ${x(physical(hand, bp.board) - 0.5)} ${y(bp.ft)})`)
      .attr('fill', p.dashed ? '#ffffff' : p.colour)
      .attr('stroke', p.colour)
      .attr('stroke-width', 2);
  }
}
