import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { toast } from 'sonner';
import { DeleteAccountSchema, type DeleteAccountInput } from '@/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { paths } from '@/config/paths';
import { useDeleteAccount } from '../api/delete-account';
import { placeServerIssues } from './server-issues';

/** Leaving Whorlbook: the password first, then one last question that says what goes. */
export function DeleteAccountForm() {
  const remove = useDeleteAccount();
  const navigate = useNavigate();
  const [asking, setAsking] = useState<DeleteAccountInput | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<DeleteAccountInput>({ resolver: zodResolver(DeleteAccountSchema), defaultValues: { password: '' } });

  const confirm = () => {
    if (!asking) return;
    setProblem(null);
    remove.mutate(asking, {
      onSuccess: (res) => {
        toast.success(res.message);
        navigate(paths.signIn, { replace: true });
      },
      onError: (error) => {
        setAsking(null);
        if (!placeServerIssues(error, form.setError, ['password'])) setProblem(error.message);
      },
    });
  };

  return (
    <form onSubmit={form.handleSubmit(setAsking)} noValidate className="flex flex-col gap-4">
      <p>
        This deletes your patterns, projects, counts, journal, photos, yarn shelf, comments and shared pages, on every
        device. It cannot be undone.
      </p>
      {problem ? <Banner tone="warning" title="Your account was not deleted">{problem}</Banner> : null}
      <TextField label="Your password" type="password" autoComplete="current-password" error={form.formState.errors.password?.message} {...form.register('password')} />
      <Button type="submit" variant="danger" className="self-start">
        Delete my account
      </Button>
      <ConfirmDialog
        open={asking !== null}
        title="Delete your account and everything in it?"
        confirmLabel="Delete everything"
        pending={remove.isPending}
        onConfirm={confirm}
        onCancel={() => setAsking(null)}
      >
        Anyone with a link to one of your shared pages will find it gone. There is no way to bring any of it back.
      </ConfirmDialog>
    </form>
  );
}
