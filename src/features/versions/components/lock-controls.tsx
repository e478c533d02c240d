import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import type { LockState, VersionSummary } from '../../../shared/versions';
import { useLockMapping, useUnlockMapping } from '../api/lock-mapping';

/** Supervisors: lock a chosen version for production (with a note), or unlock with a reason. */
export function LockControls({ mappingId, lock, versions }: { mappingId: number; lock: LockState; versions: VersionSummary[] }) {
  const [version, setVersion] = useState<number | ''>(versions[0]?.number ?? '');
  const [text, setText] = useState('');
  const doLock = useLockMapping(mappingId);
  const doUnlock = useUnlockMapping(mappingId);
  if (lock.locked) {
    return (
      <form className="flex flex-col gap-2" onSubmit={(e) => (e.preventDefault(), doUnlock.mutate({ reason: text }, { onSuccess: () => setText('') }))}>
        <TextField label="Reason for unlocking" value={text} onValueChange={setText} required maxLength={2000} />
        <ErrorAlert error={doUnlock.error} />
        <div>
          <Button type="submit" variant="danger" size="sm" pending={doUnlock.isPending} disabled={!text.trim()}>
            Unlock version {lock.version}
          </Button>
        </div>
      </form>
    );
  }
  if (!versions.length) return <p className="text-sm text-ink-600">Save a version before locking one for production.</p>;
  return (
    <form className="flex flex-col gap-2" onSubmit={(e) => (e.preventDefault(), version && doLock.mutate({ version, note: text }, { onSuccess: () => setText('') }))}>
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
        Version to lock for production
        <select className="rounded-md border border-ink-300 bg-paper-50 px-2 py-1 font-normal" value={version} onChange={(e) => setVersion(Number(e.target.value))}>
          {versions.map((v) => (
            <option key={v.number} value={v.number}>
              Version {v.number}
              {v.message ? ` — ${v.message}` : ''}
            </option>
          ))}
        </select>
      </label>
      <TextField label="Note (optional)" value={text} onValueChange={setText} maxLength={2000} />
      <ErrorAlert error={doLock.error} />
      <div>
        <Button type="submit" size="sm" pending={doLock.isPending}>
          Lock for production
        </Button>
      </div>
    </form>
  );
}
