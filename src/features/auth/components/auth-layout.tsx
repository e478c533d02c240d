import type { ReactNode } from 'react';
import { Logo } from '../../../components/ui/logo';

/** The quiet, centred page that every signed-out screen shares. */
export function AuthLayout({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center px-4 py-12">
      <div className="w-full max-w-sm">
        <div className="mb-8 flex justify-center">
          <Logo />
        </div>
        <main className="rounded-lg border border-paper-300 bg-paper-50 p-6 shadow-card">
          <h1 className="text-xl font-bold text-ink-950">{title}</h1>
          {intro && <div className="mt-1 text-sm text-ink-700">{intro}</div>}
          <div className="mt-5">{children}</div>
        </main>
        <p className="mt-6 text-center text-xs text-ink-600">Beadloom — coarse-grained mappings, drawn together.</p>
      </div>
    </div>
  );
}
