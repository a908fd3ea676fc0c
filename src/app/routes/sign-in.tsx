import { useSearchParams } from 'react-router-dom';
import { buttonClass } from '@/components/ui/button';
import { whoMay } from '@shared/permissions';

export default function SignInPage() {
  const [params] = useSearchParams();
  const returnTo = params.get('returnTo') ?? '/lines';
  return (
    <div className="grid min-h-screen place-items-center bg-ink p-4">
      <div className="w-full max-w-md rounded-2xl bg-paper p-8 shadow-xl">
        <h1 className="text-3xl font-bold tracking-tight">Linewright</h1>
        <p className="mt-2 text-ink-soft">
          Repairs and tie-ins on the plant's thermoplastic lines: joints, lockouts, cure holds and release to service.
        </p>
        <a href={`/auth/login?returnTo=${encodeURIComponent(returnTo)}`} className={buttonClass('primary', { size: 'wide', className: 'mt-8' })}>
          Sign in with the plant directory
        </a>
        <p className="mt-4 text-sm text-ink-faint">Your roles come from the plant directory; {whoMay('people.manage')} can change them here.</p>
      </div>
    </div>
  );
}
