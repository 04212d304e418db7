import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { ApiError } from '@/lib/api-client';
import type { ReportFormValues } from '@/schemas/share';
import { ReportFormSchema, useCreateReport } from '../api/create-report';

/** Asks an admin to look at a comment or the whole page. Only shown to signed-in members. */
export function ReportDialog({ target, onClose }: { target: { shareToken: string; commentId?: number }; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const report = useCreateReport();
  const form = useForm<ReportFormValues>({ resolver: zodResolver(ReportFormSchema), defaultValues: { reason: '' } });
  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal?.();
  }, []);
  const what = target.commentId !== undefined ? 'this comment' : 'this page';
  const submit = form.handleSubmit((values) =>
    report.mutate(
      { ...target, reason: values.reason },
      {
        onSuccess: () => {
          toast.success('Thank you. An admin will look at it.');
          onClose();
        },
        onError: (e) => form.setError('reason', { message: e instanceof ApiError ? e.message : 'That did not go through. Try again.' }),
      },
    ),
  );
  return (
    <dialog ref={ref} onCancel={onClose} onClose={onClose} aria-labelledby="report-title" className="m-auto w-[min(92vw,28rem)] rounded-blob bg-oat p-6 text-ink shadow-xl backdrop:bg-ink/50 dark:bg-ink dark:text-oat">
      <form onSubmit={submit} noValidate>
        <h2 id="report-title" className="text-xl font-bold">
          Report {what}
        </h2>
        <p className="mt-1 text-sm text-ink/75 dark:text-oat/75">The Whorlbook admins will read your reason and can hide it. The maker is not told who reported it.</p>
        <TextAreaField label="What is wrong?" className="mt-4" rows={3} error={form.formState.errors.reason?.message} {...form.register('reason')} />
        <div className="mt-5 flex flex-wrap justify-end gap-3">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" variant="danger" pending={report.isPending}>
            Send report
          </Button>
        </div>
      </form>
    </dialog>
  );
}
