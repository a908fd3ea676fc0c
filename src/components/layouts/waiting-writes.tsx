import { usePopover } from '@/components/ui/use-popover';
import { useFailedWrites, useOnline, useWaitingWrites } from '@/lib/offline-writes';
import { FailedWriteList } from '@/components/ui/write-list';

/**
 * The header's word on what this tablet holds: "3 waiting to send" (and "offline", and writes the
 * server refused); a tap opens the list. The status region is always there, so a change is announced.
 */
export function WaitingWrites() {
  const online = useOnline();
  const { count, labels } = useWaitingWrites();
  const failed = useFailedWrites();
  const { open, setOpen, root, panelId } = usePopover();

  const words = [!online && 'Offline', count > 0 && `${count} waiting to send`, failed.length > 0 && `${failed.length} not recorded`].filter(Boolean).join(' · ');
  const showList = count > 0 || failed.length > 0;
  return (
    <div ref={root} className="relative shrink-0">
      <div role="status">
        {words &&
          (showList ? (
            <button
              type="button"
              aria-expanded={open}
              aria-controls={panelId}
              onClick={() => setOpen((o) => !o)}
              className={`min-h-12 whitespace-nowrap rounded-full px-4 text-sm font-semibold ${failed.length ? 'bg-refuse-light text-ink' : 'bg-hold-light text-ink'}`}
            >
              {words}
            </button>
          ) : (
            <span className="inline-flex min-h-12 items-center whitespace-nowrap rounded-full bg-hold-light px-4 text-sm font-semibold text-ink">{words}</span>
          ))}
      </div>
      {open && showList && (
        <div id={panelId} className="absolute right-0 z-30 mt-2 max-h-[70vh] w-96 max-w-[90vw] overflow-y-auto rounded-xl border border-ink/15 bg-paper-raised p-3 text-ink shadow-lg">
          {count > 0 && (
            <>
              <h2 className="mb-1 font-semibold">Waiting to send, in order</h2>
              <p className="mb-2 text-sm text-ink-soft">{online ? 'Sending now; each goes once the one before it is recorded.' : 'Kept on this tablet; sent when the network is back.'}</p>
              <ol className="mb-3 list-decimal space-y-1 pl-6">
                {labels.map((l, i) => (
                  <li key={i}>{l}</li>
                ))}
              </ol>
            </>
          )}
          {failed.length > 0 && (
            <>
              <h2 className="mb-2 font-semibold">Not recorded</h2>
              <FailedWriteList failed={failed} />
            </>
          )}
        </div>
      )}
    </div>
  );
}
