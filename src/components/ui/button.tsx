import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet';

const styles: Record<Variant, string> = {
  primary: 'bg-temper text-white hover:bg-temper-deep disabled:bg-cast/60',
  secondary: 'border border-cast-line bg-white text-ink hover:border-temper hover:text-temper disabled:text-cast',
  quiet: 'text-temper hover:bg-temper-tint',
};

export function buttonClass(variant: Variant = 'primary', size: 'md' | 'lg' = 'md') {
  return `inline-flex items-center justify-center gap-2 rounded-md font-semibold transition-colors disabled:cursor-not-allowed ${
    size === 'lg' ? 'min-h-12 px-5 text-lg' : 'min-h-10 px-4'
  } ${styles[variant]}`;
}

export function Button({ variant = 'primary', size = 'md', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: 'md' | 'lg' }) {
  return <button type="button" {...props} className={`${buttonClass(variant, size)} ${className}`} />;
}
