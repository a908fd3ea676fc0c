import pino from 'pino';

// Reads LOG_LEVEL directly so the logger exists before (and while) config is parsed.
export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
  base: { service: process.env.LW_PROCESS ?? 'api' },
});
