import { z } from 'zod';

/** Queue names and the shape of each job's data: ids only, never whole objects. */
export const QUEUES = { imports: 'line-imports', mail: 'mail', sweeps: 'sweeps' } as const;

export const importJobSchema = z.object({ importId: z.string().uuid(), step: z.enum(['preview', 'apply']) });
export type ImportJob = z.infer<typeof importJobSchema>;

/** The periodic sweep carries nothing: it reads what to do from PostgreSQL. */
export const sweepJobSchema = z.object({});

export const mailJobSchema = z.object({
  to: z.string().min(3),
  subject: z.string().min(1),
  text: z.string(),
});
export type MailJob = z.infer<typeof mailJobSchema>;
