import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { PasswordChangeSchema, type PasswordChangeInput } from '@/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { useChangePassword } from '../api/change-password';
import { placeServerIssues } from './server-issues';
import { ShowPassword } from './show-password';

export function ChangePasswordForm() {
  const change = useChangePassword();
  const [shown, setShown] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<PasswordChangeInput>({ resolver: zodResolver(PasswordChangeSchema), defaultValues: { current: '', next: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setProblem(null);
    change.mutate(values, {
      onSuccess: () => form.reset(),
      onError: (error) => {
        if (!placeServerIssues(error, form.setError, ['current', 'next'])) setProblem(error.message);
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {change.isSuccess && !form.formState.isDirty ? <Banner tone="success" title="Password changed">{change.data.message}</Banner> : null}
      {problem ? <Banner tone="warning" title="Password not changed">{problem}</Banner> : null}
      <TextField label="Current password" type={shown ? 'text' : 'password'} autoComplete="current-password" error={errors.current?.message} {...form.register('current')} />
      <TextField
        label="New password"
        type={shown ? 'text' : 'password'}
        autoComplete="new-password"
        hint="At least 10 characters. Other devices are signed out when you save."
        error={errors.next?.message}
        {...form.register('next')}
      />
      <ShowPassword shown={shown} onChange={setShown} />
      <Button type="submit" size="lg" pending={change.isPending}>
        Change my password
      </Button>
    </form>
  );
}
