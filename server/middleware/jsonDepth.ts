import type { IncomingMessage, ServerResponse } from 'node:http';
import { AppError } from '../lib/AppError';
import { exceedsJsonDepth, MAX_JSON_DEPTH } from '../lib/jsonDepth';

/** express.json's `verify` hook: a body nested deeper than MAX_JSON_DEPTH is a 400 before JSON.parse sees it. */
export function jsonDepthGuard(_req: IncomingMessage, _res: ServerResponse, buf: Buffer): void {
  if (exceedsJsonDepth(buf))
    throw new AppError(400, 'json_too_deep', `The JSON body nests deeper than ${MAX_JSON_DEPTH} levels`, {
      body: `At most ${MAX_JSON_DEPTH} levels of nesting`,
    });
}
