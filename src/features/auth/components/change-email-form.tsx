import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ChangeEmailSchema, type ChangeEmailInput } from '@/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { useRequestEmailChange } from '../api/change-email';
import { placeServerIssues } from './server-issues';

/** A new sign-in address: it takes effect when the link sent to it is opened. */
export function ChangeEmailForm() {
  const change = useRequestEmailChange();
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<ChangeEmailInput>({ resolver: zodResolver(ChangeEmailSchema), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setProblem(null);
    change.mutate(values, {
      onSuccess: () => form.reset(),
      onError: (error) => {
        if (!placeServerIssues(error, form.setError, ['email', 'password'])) setProblem(error.message);
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {change.isSuccess && !form.formState.isDirty ? <Banner tone="success" title="Check the new address">{change.data.message}</Banner> : null}
      {problem ? <Banner tone="warning" title="Your e-mail was not changed">{problem}</Banner> : null}
      <TextField label="New e-mail" type="email" inputMode="email" autoComplete="email" error={errors.email?.message} {...form.register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" hint="Asked again to keep your account yours." error={errors.password?.message} {...form.register('password')} />
      <Button type="submit" size="lg" pending={change.isPending}>
        Send the link
      </Button>
    </form>
  );
}
