import { dismissWrite, sendAgain, type FailedWrite } from '@/lib/offline-writes';
import { Button } from '@/components/ui/button';

/**
 * Writes from this tablet that did not go through, each with the server's words. A refusal can only
 * be dismissed (sending it again would be refused again); anything else may be sent again.
 */
export function FailedWriteList({ failed }: { failed: readonly FailedWrite[] }) {
  if (!failed.length) return null;
  return (
    <ul className="space-y-2">
      {failed.map((f) => (
        <li key={f.id} className="rounded-lg border border-refuse/40 bg-refuse-light p-3 text-ink">
          <p className="font-semibold">{f.write.label}: not recorded</p>
          <p className="mt-0.5">{f.message}</p>
          <div className="mt-2 flex flex-wrap gap-2">
            {!f.refused && (
              <Button type="button" size="lg" onClick={() => sendAgain(f.id)}>
                Send again
              </Button>
            )}
            <Button type="button" variant="secondary" size="lg" onClick={() => dismissWrite(f.id)}>
              Dismiss
            </Button>
          </div>
        </li>
      ))}
    </ul>
  );
}
