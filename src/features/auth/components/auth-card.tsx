import type { ReactNode } from 'react';

/** The frame of the signed-out pages: product name, a heading, the form. */
export function AuthCard({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-start justify-center px-4 py-16">
      <div className="flex w-full max-w-sm flex-col gap-6">
        <p className="text-lg font-semibold tracking-tight text-accent">Shedwright</p>
        <div className="flex flex-col gap-5 rounded-lg border border-line bg-surface p-6 shadow-sm">
          <h1 className="text-2xl font-semibold">{title}</h1>
          {children}
        </div>
      </div>
    </main>
  );
}
