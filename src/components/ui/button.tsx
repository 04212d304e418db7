import { forwardRef, type ButtonHTMLAttributes } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cn } from '@/utils/cn';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';
type Size = 'md' | 'lg';

const base =
  'inline-flex items-center justify-center gap-2 rounded-soft font-semibold transition-colors disabled:opacity-50 disabled:cursor-not-allowed min-h-tap min-w-tap select-none';
const variants: Record<Variant, string> = {
  primary: 'bg-moss text-oat hover:bg-moss-dark active:bg-moss-dark',
  secondary: 'bg-wool text-ink hover:bg-[#d9ccb4] dark:bg-[#3a3430] dark:text-oat dark:hover:bg-[#4a423c]',
  quiet: 'bg-transparent text-moss hover:bg-wool/60 dark:text-[#9cc3a8] dark:hover:bg-white/10',
  danger: 'bg-clay text-oat hover:bg-clay-dark',
};
const sizes: Record<Size, string> = { md: 'px-5 py-2.5 text-base', lg: 'px-6 py-4 text-lg' };

export function buttonClasses(variant: Variant = 'primary', size: Size = 'md', className?: string) {
  return cn(base, variants[variant], sizes[size], className);
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  pending?: boolean;
}

export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant = 'primary', size = 'md', pending, className, children, disabled, type = 'button', ...rest },
  ref,
) {
  return (
    <button
      ref={ref}
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...rest}
    >
      {pending ? <span className="inline-block h-4 w-4 animate-spin rounded-full border-2 border-current border-t-transparent" aria-hidden /> : null}
      {children}
    </button>
  );
});

export function ButtonLink({ variant = 'primary', size = 'md', className, ...rest }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClasses(variant, size, className)} {...rest} />;
}
