import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card.tsx';

interface FormPageProps {
  /** The page's one h1, also the document title. */
  title: string;
  intro?: ReactNode;
  children: ReactNode;
}

/** A narrow page around one card: sign-in, password reset, invitation and the like. */
export function FormPage({ title, intro, children }: FormPageProps) {
  return (
    <div className="mx-auto w-full max-w-md">
      <title>{`${title} · Biasproof`}</title>
      <Card aria-labelledby="form-page-heading">
        <h1 id="form-page-heading" className="text-2xl font-bold text-ink-900">
          {title}
        </h1>
        {intro ? <div className="mt-2 text-ink-600">{intro}</div> : null}
        <div className="mt-6 flex flex-col gap-4">{children}</div>
      </Card>
    </div>
  );
}
