import { createServer } from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

/** A local SMTP sink for development and tests: keeps every message, shows them over HTTP. */
export interface CapturedMail {
  id: number;
  at: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  /** The HTML body, or '' for a plain-text mail. */
  html: string;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export async function startMailSink(opts: { smtpPort: number; httpPort: number }) {
  const messages: CapturedMail[] = [];
  const smtp = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'], // nodemailer trips over the built-in expired certificate otherwise
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.push({
            id: messages.length + 1,
            at: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
          });
          callback();
        })
        .catch(callback);
    },
  });
  // A port in use rejects here (the caller stops what it started) instead of crashing the process.
  await new Promise<void>((resolve, reject) => (smtp.once('error', reject), smtp.listen(opts.smtpPort, '127.0.0.1', resolve)));

  const http = createServer((req, res) => {
    if (req.method === 'GET' && req.url === '/messages') {
      res.setHeader('content-type', 'application/json');
      res.end(JSON.stringify(messages));
      return;
    }
    if (req.method === 'DELETE' && req.url === '/messages') {
      messages.length = 0;
      res.end();
      return;
    }
    const rows = [...messages].reverse().map((m) => `<article><h2>${esc(m.subject)}</h2><p><b>to</b> ${esc(m.to.join(', '))} · ${m.at}</p><pre>${esc(m.text)}</pre></article>`);
    res.setHeader('content-type', 'text/html; charset=utf-8');
    res.end(`<!doctype html><title>Captured mail</title><body style="font:15px system-ui;max-width:50rem;margin:2rem auto"><h1>Captured mail (${messages.length})</h1>${rows.join('<hr>') || '<p>No mail yet.</p>'}</body>`);
  });
  try {
    await new Promise<void>((resolve, reject) => http.once('error', reject).listen(opts.httpPort, '127.0.0.1', resolve));
  } catch (err) {
    await new Promise<void>((r) => smtp.close(() => r()));
    throw err;
  }
  return {
    messages,
    viewerUrl: `http://127.0.0.1:${opts.httpPort}/`,
    stop: async () => {
      http.closeAllConnections();
      await new Promise<void>((r) => http.close(() => r()));
      await new Promise<void>((r) => smtp.close(() => r()));
    },
  };
}
