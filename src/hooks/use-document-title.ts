import { useEffect } from 'react';

/** Sets the tab title to "<title> · Beadloom" while the page is shown. */
export function useDocumentTitle(title: string | undefined): void {
  useEffect(() => {
    document.title = title ? `${title} · Beadloom` : 'Beadloom';
  }, [title]);
}
