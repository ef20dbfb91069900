import pino from 'pino';
import { config } from '../config/index';

/** The server's one logger (JSON lines; quiet in tests unless LOG_LEVEL says otherwise). */
export const logger = pino({
  level: config.LOG_LEVEL,
  redact: ['req.headers.authorization', 'password', 'passwordHash', '*.password'],
});
