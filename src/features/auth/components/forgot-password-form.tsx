import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { PasswordResetRequestSchema, type PasswordResetRequestInput } from '@/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { paths } from '@/config/paths';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { placeServerIssues } from './server-issues';

export function ForgotPasswordForm({ afterSent }: { afterSent?: React.ReactNode }) {
  const request = useRequestPasswordReset();
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<PasswordResetRequestInput>({ resolver: zodResolver(PasswordResetRequestSchema), defaultValues: { email: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setProblem(null);
    request.mutate(values, {
      onError: (error) => {
        if (!placeServerIssues(error, form.setError, ['email'])) setProblem(error.message);
      },
    });
  });

  if (request.isSuccess) {
    return (
      <div className="flex flex-col gap-4">
        <Banner tone="success" title="Check your e-mail">
          {request.data.message}
        </Banner>
        {afterSent}
        <Link className="inline-flex min-h-tap items-center font-semibold text-moss underline dark:text-[#9cc3a8]" to={paths.signIn}>
          Back to sign in
        </Link>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem ? <Banner tone="warning" title="Not sent">{problem}</Banner> : null}
      <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...form.register('email')} />
      <Button type="submit" size="lg" pending={request.isPending}>
        Send me a reset link
      </Button>
      <Link className="inline-flex min-h-tap items-center text-sm font-semibold text-moss underline dark:text-[#9cc3a8]" to={paths.signIn}>
        I remember it: back to sign in
      </Link>
    </form>
  );
}
