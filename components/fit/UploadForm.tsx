'use client';
// The file picker and unit choice. Choosing a file reads it at once (a preview, nothing stored).
import { useRef, useState } from 'react';
import { Button } from '@/components/ui/primitives';
import { SelectField } from '@/components/ui/Field';
import { sendFile } from '@/lib/client/fetcher';
import type { LogPreview } from '@/lib/views/logs';

const MAX_BYTES = 5 * 1024 * 1024;

export function UploadForm({ aircraftId, onPreview, onError }: { aircraftId: number; onPreview: (file: File, unit: 'auto' | 'C' | 'F', p: LogPreview) => void; onError: (message: string) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [unit, setUnit] = useState<'auto' | 'C' | 'F'>('auto');
  const [pending, setPending] = useState(false);
  const [fieldError, setFieldError] = useState('');

  async function read(f: File | null, u: 'auto' | 'C' | 'F') {
    if (!f) {
      setFieldError('Choose a CSV file.');
      return;
    }
    if (f.size > MAX_BYTES) {
      const m = `The file is ${(f.size / 1024 / 1024).toFixed(1)} MB; the limit is 5 MB. Split the log or export only the cool-down.`;
      setFieldError(m);
      onError(m);
      return;
    }
    setFieldError('');
    setPending(true);
    const q = new URLSearchParams({ fileName: f.name, unit: u });
    const r = await sendFile<{ preview: LogPreview }>(`/api/aircraft/${aircraftId}/logs/preview?${q}`, f);
    setPending(false);
    if (r.ok) onPreview(f, u, r.data.preview);
    else {
      setFieldError(r.fields.file ?? r.fields.unit ?? '');
      onError(r.message);
    }
  }

  return (
    <form
      className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_12rem_auto] sm:items-start"
      onSubmit={(e) => {
        e.preventDefault();
        void read(file, unit);
      }}
      noValidate
    >
      <div className="space-y-1">
        <label htmlFor="cal-file" className="block text-sm font-medium text-slate-800 dark:text-slate-200">
          Logger file (CSV)
        </label>
        <input
          ref={input}
          id="cal-file"
          name="file"
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          aria-invalid={fieldError ? true : undefined}
          aria-describedby={fieldError ? 'cal-file-error' : 'cal-file-hint'}
          onChange={(e) => {
            const f = e.target.files?.[0] ?? null;
            setFile(f);
            if (f) void read(f, unit);
          }}
          className="block min-h-11 w-full rounded-xl border border-slate-300 bg-white text-sm text-slate-700 file:mr-3 file:min-h-11 file:border-0 file:bg-ice-700 file:px-4 file:font-semibold file:text-white hover:file:bg-ice-800 dark:border-slate-700 dark:bg-slate-950 dark:text-slate-200"
        />
        {fieldError ? (
          <p id="cal-file-error" className="text-sm font-medium text-red-700 dark:text-red-300">
            {fieldError}
          </p>
        ) : (
          <p id="cal-file-hint" className="text-xs text-slate-500 dark:text-slate-400">
            Dates like 2026-11-30 17:45, 30.11.2026 17:45, 11/30/2026 5:45 PM or unix seconds.
          </p>
        )}
      </div>
      <SelectField
        id="cal-unit"
        label="Temperature unit"
        value={unit}
        onChange={(e) => {
          const u = e.target.value as 'auto' | 'C' | 'F';
          setUnit(u);
          if (file) void read(file, u);
        }}
      >
        <option value="auto">Detect from the file</option>
        <option value="C">°C</option>
        <option value="F">°F</option>
      </SelectField>
      <Button type="submit" variant="secondary" disabled={pending || !file} className="sm:mt-6">
        {pending ? 'Reading…' : 'Read again'}
      </Button>
    </form>
  );
}
