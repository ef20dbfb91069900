import { expose } from 'comlink';
import { pairAdvice, rankArsenal, type RankArsenalInput } from '@engine/index';

/**
 * The engine off the main thread: the what-if and the coach's side by side rank their changed balls here, and a
 * session asks how the pair's wear ranks the bag, so the page keeps answering input while a prediction (about
 * 150 ms per ball on a slow machine) runs.
 */
const engine = {
  rankArsenal(input: RankArsenalInput) {
    return rankArsenal(input);
  },
  pairAdvice(input: Parameters<typeof pairAdvice>[0]) {
    return pairAdvice(input);
  },
};

export type EngineWorker = typeof engine;

expose(engine);
