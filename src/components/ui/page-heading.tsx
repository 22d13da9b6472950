import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

export interface PageHeadingProps {
  title: ReactNode;
  /** A link up to the list this page belongs to. */
  back?: { to: string; label: string };
  children?: ReactNode;
}

/** A page's h1, with an optional way back above it and a line or two below. */
export function PageHeading({ title, back, children }: PageHeadingProps) {
  return (
    <div className="flex flex-col gap-1">
      {back && (
        <p className="text-sm">
          <Link to={back.to}>
            <span aria-hidden="true">←</span> {back.label}
          </Link>
        </p>
      )}
      <h1 className="text-2xl font-semibold">{title}</h1>
      {children}
    </div>
  );
}

/** What a page says when the thing it shows is absent (or hidden from this person), with a way on. */
export function MissingNotice({ title, children, back }: { title: string; children: ReactNode; back: { to: string; label: string } }) {
  return (
    <div className="flex max-w-xl flex-col gap-3">
      <h1 className="text-2xl font-semibold">{title}</h1>
      <p>{children}</p>
      <p>
        <Link to={back.to}>{back.label}</Link>
      </p>
    </div>
  );
}
