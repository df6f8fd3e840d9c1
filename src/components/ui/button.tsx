import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';
type Size = 'md' | 'lg' | 'xl';

const variants: Record<Variant, string> = {
  primary: 'bg-harbour-800 text-white hover:bg-harbour-700 disabled:bg-harbour-600/60',
  secondary: 'bg-white text-harbour-800 border-2 border-harbour-800 hover:bg-harbour-50 disabled:opacity-60',
  danger: 'bg-stop-700 text-white hover:bg-stop-700/90 disabled:opacity-60',
  ghost: 'bg-transparent text-harbour-800 hover:bg-harbour-50 disabled:opacity-60',
};
// Every size is at least 44 px tall (WCAG 2.5.5 target size); xl is for gloved hands on tablets.
const sizes: Record<Size, string> = {
  md: 'min-h-11 px-4 text-base',
  lg: 'min-h-14 px-6 text-lg',
  xl: 'min-h-20 px-8 text-2xl',
};

export function Button({
  variant = 'primary',
  size = 'md',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: Size }) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-2 rounded-lg font-bold transition-colors disabled:cursor-not-allowed ${variants[variant]} ${sizes[size]} ${className}`}
      {...props}
    />
  );
}
