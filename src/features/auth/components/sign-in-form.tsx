import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { SignInSchema, type SignInInput } from '@/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Banner } from '@/components/ui/banner';
import { paths } from '@/config/paths';
import { useSignIn } from '../api/sign-in';
import { useDemoAccount } from '../api/get-demo';

export function SignInForm() {
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const signIn = useSignIn();
  const demo = useDemoAccount();
  const form = useForm<SignInInput>({ resolver: zodResolver(SignInSchema), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: () => {
        const next = search.get('next');
        navigate(next && next.startsWith('/') && !next.startsWith('//') ? next : paths.home, { replace: true });
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {signIn.error ? <Banner tone="warning" title="Not signed in">{signIn.error.message}</Banner> : null}
      <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...form.register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...form.register('password')} />
      <Button type="submit" size="lg" pending={signIn.isPending}>
        Sign in
      </Button>
      <div className="flex flex-wrap justify-between gap-2 text-sm">
        <Link className="inline-flex min-h-tap items-center font-semibold text-moss underline dark:text-[#9cc3a8]" to={paths.forgotPassword}>
          Forgot your password?
        </Link>
        <Link className="inline-flex min-h-tap items-center font-semibold text-moss underline dark:text-[#9cc3a8]" to={paths.signUp}>
          New here? Make an account
        </Link>
      </div>
      {demo.data ? (
        <Banner tone="info" title="Trying Whorlbook? Use the demo maker">
          <p>
            E-mail <code className="font-sans font-bold">{demo.data.email}</code>, password <code className="font-sans font-bold">{demo.data.password}</code>
          </p>
          <Button
            variant="quiet"
            className="mt-2 ring-2 ring-moss"
            onClick={() => {
              form.setValue('email', demo.data!.email);
              form.setValue('password', demo.data!.password);
            }}
          >
            Fill in the demo account
          </Button>
        </Banner>
      ) : null}
    </form>
  );
}
