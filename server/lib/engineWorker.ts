// Worker-thread entry for heavy engine calls (see enginePool.ts).
import { rankArsenal } from '../../engine/index';
import type { RankArsenalInput, RankedBall } from '../../engine/types';

export function rank(input: RankArsenalInput): RankedBall[] {
  return rankArsenal(input);
}
