import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate } from 'react-router-dom';
import { toast } from 'sonner';
import { SignUpSchema, type SignUpInput } from '@/schemas/auth';
import { ApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { paths } from '@/config/paths';
import { useSignUp } from '../api/sign-up';
import { placeServerIssues } from './server-issues';
import { ShowPassword } from './show-password';

const link = 'inline-flex min-h-tap items-center font-semibold text-moss underline dark:text-[#9cc3a8]';

export function SignUpForm() {
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [shown, setShown] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<SignUpInput>({ resolver: zodResolver(SignUpSchema), defaultValues: { displayName: '', email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setProblem(null);
    signUp.mutate(values, {
      onSuccess: ({ user }) => {
        toast.success(`Welcome to Whorlbook, ${user.displayName}!`);
        navigate(paths.home, { replace: true });
      },
      onError: (error) => {
        if (error instanceof ApiError && error.status === 409) form.setError('email', { type: 'server', message: error.message }, { shouldFocus: true });
        else if (!placeServerIssues(error, form.setError, ['displayName', 'email', 'password'])) setProblem(error.message);
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem ? <Banner tone="warning" title="No account made yet">{problem}</Banner> : null}
      <TextField label="Your name" hint="Shown to friends on pages you share." autoComplete="name" error={errors.displayName?.message} {...form.register('displayName')} />
      <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...form.register('email')} />
      {errors.email?.type === 'server' ? (
        <Link className={link} to={paths.signIn}>
          Sign in with that e-mail instead
        </Link>
      ) : null}
      <TextField
        label="Password"
        type={shown ? 'text' : 'password'}
        autoComplete="new-password"
        hint="At least 10 characters. A short sentence you will remember works well."
        error={errors.password?.message}
        {...form.register('password')}
      />
      <ShowPassword shown={shown} onChange={setShown} />
      <Button type="submit" size="lg" pending={signUp.isPending}>
        Make my account
      </Button>
      <p className="text-sm">
        Already have an account?{' '}
        <Link className={link} to={paths.signIn}>
          Sign in
        </Link>
      </p>
    </form>
  );
}
