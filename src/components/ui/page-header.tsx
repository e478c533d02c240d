import type { ReactNode } from 'react';

interface PageHeaderProps {
  title: string;
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}

export function PageHeader({ title, eyebrow, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div className="min-w-0">
        {eyebrow && <div className="mb-1 text-sm text-ink-600">{eyebrow}</div>}
        <h1 className="text-2xl font-bold tracking-tight text-ink-950">{title}</h1>
        {description && <div className="mt-1 max-w-prose text-ink-700">{description}</div>}
      </div>
      {actions && <div className="flex gap-2">{actions}</div>}
    </header>
  );
}
