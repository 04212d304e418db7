import { PartyPopper } from 'lucide-react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { useSetCheer } from '../api/cheer';
import type { CheerSummary } from '@/types/showcase';

/** One cheer per member. The state is in the words ("Cheer" / "You cheered") and aria-pressed, not only the colour. */
export function CheerButton({ token, cheers, signedIn }: { token: string; cheers: CheerSummary; signedIn: boolean }) {
  const setCheer = useSetCheer(token);
  const navigate = useNavigate();
  const count = cheers.count;
  const label = cheers.cheered ? 'You cheered' : 'Cheer';
  return (
    <Button
      variant={cheers.cheered ? 'primary' : 'secondary'}
      size="lg"
      aria-pressed={signedIn ? cheers.cheered : undefined}
      pending={setCheer.isPending}
      onClick={() => (signedIn ? setCheer.mutate(!cheers.cheered) : navigate(`${paths.signIn}?next=${encodeURIComponent(paths.showcase(token))}`))}
      className="print:hidden"
    >
      <PartyPopper aria-hidden className="h-5 w-5" />
      <span>{label}</span>
      <span className="tabular rounded-full bg-oat/30 px-2 text-base" aria-label={`${count} ${count === 1 ? 'cheer' : 'cheers'} so far`}>
        {count}
      </span>
    </Button>
  );
}
