import { useRef } from 'react';
import { Button } from '../../../components/ui/button';

/** Picks a CSV file and hands its text on; the server parses and checks it (same columns as the export). */
export function CsvImportButton({ onImport, pending }: { onImport(csv: string): void; pending: boolean }) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <>
      <input
        ref={input}
        type="file"
        accept=".csv,text/csv"
        className="sr-only"
        tabIndex={-1}
        aria-hidden="true"
        onChange={async (e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (file) onImport(await file.text());
        }}
      />
      <Button variant="secondary" size="sm" disabled={pending} onClick={() => input.current?.click()}>Import CSV…</Button>
    </>
  );
}
