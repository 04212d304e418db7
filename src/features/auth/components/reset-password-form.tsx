import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { PasswordResetConfirmSchema, type PasswordResetConfirmInput } from '@/schemas/auth';
import { Button, ButtonLink } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { paths } from '@/config/paths';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';
import { placeServerIssues } from './server-issues';
import { ShowPassword } from './show-password';

export function ResetPasswordForm({ token }: { token: string }) {
  const confirm = useConfirmPasswordReset();
  const [shown, setShown] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<PasswordResetConfirmInput>({ resolver: zodResolver(PasswordResetConfirmSchema), defaultValues: { token, password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setProblem(null);
    confirm.mutate(values, {
      onError: (error) => {
        if (!placeServerIssues(error, form.setError, ['password'])) setProblem(error.message);
      },
    });
  });

  if (confirm.isSuccess) {
    return (
      <div className="flex flex-col gap-4">
        <Banner tone="success" title="Password changed">
          {confirm.data.message}
        </Banner>
        <ButtonLink to={paths.signIn} size="lg">
          Sign in
        </ButtonLink>
      </div>
    );
  }
  // A token the schema already refuses (cut-off link) is said once, up front, rather than as a field error.
  const tokenProblem = errors.token?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem || tokenProblem ? (
        <Banner tone="warning" title="Password not changed">
          {problem ?? tokenProblem}{' '}
          <Link className="font-semibold underline" to={paths.forgotPassword}>
            Ask for a new link
          </Link>
        </Banner>
      ) : null}
      <input type="hidden" {...form.register('token')} />
      <TextField
        label="New password"
        type={shown ? 'text' : 'password'}
        autoComplete="new-password"
        hint="At least 10 characters. A short sentence you will remember works well."
        error={errors.password?.message}
        {...form.register('password')}
      />
      <ShowPassword shown={shown} onChange={setShown} />
      <Button type="submit" size="lg" pending={confirm.isPending}>
        Save my new password
      </Button>
    </form>
  );
}
