import { useId, useState } from 'react';
import { Copy, ExternalLink, Lock, Link2, Globe, RefreshCw, Printer, Download, Check } from 'lucide-react';
import { toast } from 'sonner';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CheckboxField } from '@/components/ui/field';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Loading } from '@/components/ui/page';
import { cn } from '@/utils/cn';
import { useShareStatus } from '../api/get-share-status';
import { useSetVisibility, type Visibility } from '../api/set-visibility';
import { useNewShareLink } from '../api/new-share-link';
import { useShareSettings, useUpdateShareSettings } from '../api/share-settings';
import { plural } from '../format';
import { useQrDataUrl } from './qr-code';

const choices: Array<{ value: Visibility; title: string; detail: string; icon: typeof Lock }> = [
  { value: 'private', title: 'Private', detail: 'Only you can see this project.', icon: Lock },
  { value: 'link', title: 'Anyone with the link', detail: 'Friends you send the link to can see the page. It is not listed anywhere.', icon: Link2 },
  { value: 'public', title: 'Public on my profile', detail: 'Listed on your maker page for anyone to find.', icon: Globe },
];

/**
 * The owner's sharing controls on the project page: who can see the showcase, the link (copy, open, replace), its
 * QR code for a craft-fair table card, and whether comments arrive by e-mail. `onChanged` lets the project screen
 * refresh its own copy of the project after a change.
 */
export function SharePanel({ projectId, title, onChanged }: { projectId: number; title?: string; onChanged?: () => void }) {
  const status = useShareStatus(projectId);
  const setVisibility = useSetVisibility(projectId, onChanged);
  // Set in the click itself so the radio shows the choice at once (the mutation's own state arrives a tick later).
  const [choosing, setChoosing] = useState<Visibility | null>(null);
  const newLink = useNewShareLink(projectId, onChanged);
  const settings = useShareSettings();
  const updateSettings = useUpdateShareSettings();
  const [confirmNew, setConfirmNew] = useState(false);
  const [copied, setCopied] = useState(false);
  const share = status.data;
  const qr = useQrDataUrl(share?.shareUrl);
  const name = useId();

  const copy = async () => {
    if (!share?.shareUrl) return;
    try {
      await navigator.clipboard.writeText(share.shareUrl);
      setCopied(true);
      window.setTimeout(() => setCopied(false), 2500);
    } catch {
      toast.error('Your browser did not allow copying. Select the link and copy it yourself.');
    }
  };

  return (
    <Card>
      <section aria-labelledby={`${name}-title`}>
        <h2 id={`${name}-title`} className="text-xl font-bold">
          Sharing
        </h2>
        <p className="mt-1 text-sm text-ink/70 dark:text-oat/70">Turn {title ? `“${title}”` : 'this project'} into a page to show friends, with credit to the pattern.</p>

        {status.isPending ? (
          <Loading label="Checking how it is shared…" />
        ) : !share ? null : (
          <>
            {share.hiddenByAdmin ? (
              <Banner tone="warning" title="An admin took this page down" className="mt-4">
                It was hidden after a report, so the link does not work and it cannot be shared again. Write to the Whorlbook admins if you think that was a mistake.
              </Banner>
            ) : null}

            <fieldset className="mt-4" disabled={share.hiddenByAdmin || setVisibility.isPending}>
              <legend className="mb-2 font-semibold">Who can see the page</legend>
              <div className="grid gap-2">
                {choices.map((c) => {
                  // The choice shows at once while the change is on its way; a refusal puts the old one back.
                  const on = (choosing ?? share.visibility) === c.value;
                  const Icon = c.icon;
                  return (
                    <label
                      key={c.value}
                      className={cn(
                        'flex min-h-tap cursor-pointer items-start gap-3 rounded-soft border-2 p-3 transition-colors',
                        on ? 'border-moss bg-moss/10' : 'border-wool hover:border-moss/60 dark:border-[#4a423c]',
                      )}
                    >
                      <input
                        type="radio"
                        name={`${name}-visibility`}
                        value={c.value}
                        checked={on}
                        onChange={() => {
                          setChoosing(c.value);
                          setVisibility.mutate(c.value, { onSettled: () => setChoosing(null) });
                        }}
                        className="mt-1 h-5 w-5 shrink-0 accent-moss"
                      />
                      <Icon aria-hidden className="mt-0.5 h-5 w-5 shrink-0 text-moss dark:text-[#9cc3a8]" />
                      <span>
                        <span className="block font-semibold">
                          {c.title}
                          {on ? <span className="ml-2 text-sm font-bold text-moss dark:text-[#9cc3a8]">· chosen</span> : null}
                        </span>
                        <span className="block text-sm text-ink/70 dark:text-oat/70">{c.detail}</span>
                      </span>
                    </label>
                  );
                })}
              </div>
            </fieldset>

            {share.shareUrl ? (
              <div className="mt-5 space-y-3">
                <label className="block">
                  <span className="mb-1.5 block font-semibold">The link</span>
                  <input
                    readOnly
                    value={share.shareUrl}
                    onFocus={(e) => e.currentTarget.select()}
                    className="min-h-tap w-full rounded-soft border-2 border-wool bg-white px-4 py-3 font-sans text-sm text-ink dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat"
                    aria-describedby={`${name}-counts`}
                  />
                </label>
                <p id={`${name}-counts`} className="tabular text-sm text-ink/70 dark:text-oat/70">
                  {plural(share.cheerCount, 'cheer')} · {plural(share.commentCount, 'comment')}
                  {share.hiddenCommentCount ? ` · ${share.hiddenCommentCount} hidden` : ''} · {plural(share.photoCount, 'photo')} on the page
                </p>
                {share.coverHidden ? (
                  <Banner tone="info" title="Your cover is not on the page">
                    It belongs to a journal entry that is not shown, so the page opens with another photo. Tick “Show this entry when I share the project” on that entry to use it.
                  </Banner>
                ) : null}
                <div className="flex flex-wrap gap-2">
                  <Button onClick={copy}>
                    {copied ? <Check aria-hidden className="h-5 w-5" /> : <Copy aria-hidden className="h-5 w-5" />}
                    {copied ? 'Copied' : 'Copy link'}
                  </Button>
                  <a href={share.sharePath ?? share.shareUrl} target="_blank" rel="noopener" className="inline-flex min-h-tap items-center gap-2 rounded-soft bg-wool px-5 font-semibold text-ink hover:bg-[#d9ccb4] dark:bg-[#3a3430] dark:text-oat">
                    <ExternalLink aria-hidden className="h-5 w-5" /> Open the page
                  </a>
                  {share.profilePath ? (
                    <a href={share.profilePath} target="_blank" rel="noopener" className="inline-flex min-h-tap items-center gap-2 rounded-soft px-3 font-semibold text-moss hover:bg-wool/60 dark:text-[#9cc3a8]">
                      <Globe aria-hidden className="h-5 w-5" /> Your maker page
                    </a>
                  ) : null}
                  <Button variant="quiet" onClick={() => setConfirmNew(true)}>
                    <RefreshCw aria-hidden className="h-5 w-5" /> Make a new link
                  </Button>
                </div>

                <div className="space-y-3 rounded-soft bg-oat p-3 dark:bg-ink/60">
                  <div className="flex items-center gap-4">
                    {qr ? <img src={qr} alt="QR code of the link" className="h-28 w-28 shrink-0 rounded-md bg-white p-1" data-testid="share-qr" /> : <div className="h-28 w-28 shrink-0 animate-pulse rounded-md bg-wool" />}
                    <p className="text-sm">For a craft-fair table: people scan the code to see the photos and how it was made.</p>
                  </div>
                  <div>
                    <div className="flex flex-wrap gap-2">
                      <a href={`${share.sharePath ?? ''}?print=card`} target="_blank" rel="noopener" className="inline-flex min-h-tap items-center gap-2 rounded-soft bg-wool px-4 font-semibold text-ink hover:bg-[#d9ccb4] dark:bg-[#3a3430] dark:text-oat">
                        <Printer aria-hidden className="h-5 w-5" /> Print table card
                      </a>
                      {qr ? (
                        <a href={qr} download="whorlbook-qr.png" className="inline-flex min-h-tap items-center gap-2 rounded-soft px-3 font-semibold text-moss hover:bg-wool/60 dark:text-[#9cc3a8]">
                          <Download aria-hidden className="h-5 w-5" /> QR image
                        </a>
                      ) : null}
                    </div>
                  </div>
                </div>
              </div>
            ) : null}

            <p className="mt-4 text-sm text-ink/70 dark:text-oat/70">
              The page shows photos, materials, pieces and placements. From the journal it shows only the entries you tick “Show this entry when I share the project”
              {share.shownEntryCount ? ` (${share.shownEntryCount} marked now)` : ' (none marked yet)'}, with their photos; marked entries tagged as a change appear under “Changes from the pattern”. Your e-mail address, notes and who it is for never appear. A new link also retires the photo links of the old page.
            </p>

            <div className="mt-4 border-t border-wool pt-3 dark:border-[#4a423c]">
              {settings.data ? (
                <CheckboxField
                  label="E-mail me when someone comments (at most one an hour per project)"
                  checked={settings.data.notifyComments}
                  disabled={updateSettings.isPending}
                  onChange={(e) => updateSettings.mutate({ notifyComments: e.currentTarget.checked })}
                />
              ) : null}
            </div>
          </>
        )}
      </section>
      <ConfirmDialog
        open={confirmNew}
        title="Make a new link?"
        confirmLabel="Make a new link"
        pending={newLink.isPending}
        onCancel={() => setConfirmNew(false)}
        onConfirm={() =>
          newLink.mutate(undefined, {
            onSuccess: () => {
              setConfirmNew(false);
              toast.success('New link made. The old one no longer works.');
            },
          })
        }
      >
        <p>The old link stops working at once, including printed QR codes. Anyone you sent it to will need the new one.</p>
      </ConfirmDialog>
    </Card>
  );
}
