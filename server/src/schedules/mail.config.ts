/** Where publication e-mails go: SMTP_HOST, SMTP_PORT, SMTP_FROM (defaults: the local fake). */
export interface MailConfig {
  host: string;
  port: number;
  from: string;
}

export function loadMailConfig(env: NodeJS.ProcessEnv = process.env): MailConfig {
  const raw = env.SMTP_PORT ?? '';
  const port = raw === '' ? 2525 : Number(raw);
  if (!Number.isInteger(port) || port <= 0 || port > 65535) throw new Error(`Configuration: SMTP_PORT must be a port number, got "${raw}"`);
  return { host: env.SMTP_HOST || '127.0.0.1', port, from: env.SMTP_FROM || 'Morrowline schedules <schedules@tallowmere.example>' };
}
