import type { IncomingMessage, ServerResponse } from 'node:http';
import { pino, type DestinationStream, type Logger } from 'pino';
import type { Options as PinoHttpOptions } from 'pino-http';

export function createLogger(level: string, destination?: DestinationStream): Logger {
  return pino({ level, redact: ['req.headers.cookie', 'res.headers["set-cookie"]'] }, destination);
}

/**
 * Request logs: at info one line per request with method, path, status and time — no headers
 * (they carry addresses, agents and tokens nobody needs day to day); whole headers only at debug.
 */
export function requestLogOptions(logger: Logger): PinoHttpOptions {
  const verbose = logger.isLevelEnabled('debug');
  return {
    logger,
    autoLogging: { ignore: (req) => req.url === '/api/health' },
    ...(verbose
      ? {}
      : {
          serializers: {
            req: (req: IncomingMessage & { id?: unknown }) => ({ id: req.id, method: req.method, url: req.url }),
            res: (res: ServerResponse) => ({ statusCode: res.statusCode }),
          },
        }),
  };
}
