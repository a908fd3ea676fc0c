import type { CapturedMail } from '../../scripts/mail-sink';
import { TEST_PORTS } from './ports';

/** Every mail the test mail sink has caught whose plain text mentions `text` (a file name, an id). */
export async function mailMentioning(text: string): Promise<CapturedMail[]> {
  const all = (await (await fetch(`http://127.0.0.1:${TEST_PORTS.mailHttp}/messages`)).json()) as CapturedMail[];
  return all.filter((m) => m.text.includes(text));
}
