/**
 * Public types of the Lanewright engine, by concept: the ball (ball.ts), the bowler (bowler.ts), oil patterns
 * and the lane (pattern.ts), game scores (game.ts), the matchup (matchup.ts); the shot log's in
 * ../shotlog/types.ts. Units: feet from the foul line, boards (1–39), inches, lb, mph, rpm, degrees, mL and µL.
 */
export type * from './ball';
export type * from './bowler';
export type * from './pattern';
export type * from './game';
export type * from './matchup';
