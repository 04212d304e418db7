import type { HTMLAttributes } from 'react';
import { cn } from '@/utils/cn';

export function Card({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cn('rounded-blob bg-white/80 p-5 shadow-sm ring-1 ring-wool dark:bg-[#332e2a] dark:ring-[#4a423c]', className)} {...rest} />;
}
