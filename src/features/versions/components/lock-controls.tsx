import { useWatch } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { lockBody, unlockBody, type LockState, type VersionSummary } from '../../../shared/versions';
import { useLockMapping, useUnlockMapping } from '../api/lock-mapping';

// The version select holds the number as text.
const lockSchema = z
  .object({ version: z.string(), note: z.string() })
  .transform((v): z.input<typeof lockBody> => ({ version: Number(v.version), note: v.note }))
  .pipe(lockBody);

/** Supervisors: lock a chosen version for production (with a note), or unlock with a reason. */
export function LockControls({ mappingId, lock, versions }: { mappingId: number; lock: LockState; versions: VersionSummary[] }) {
  if (lock.locked) return <UnlockForm mappingId={mappingId} version={lock.version} />;
  if (!versions.length) return <p className="text-sm text-ink-600">Save a version before locking one for production.</p>;
  return <LockForm mappingId={mappingId} versions={versions} />;
}

function UnlockForm({ mappingId, version }: { mappingId: number; version: number | null }) {
  const doUnlock = useUnlockMapping(mappingId);
  const form = useZodForm(unlockBody, { reason: '' });
  const reason = useWatch({ control: form.control, name: 'reason' });
  return (
    <Form form={form} serverError={doUnlock.error} onSubmit={(body) => doUnlock.mutate(body, { onSuccess: () => form.reset() })} className="flex flex-col gap-2">
      <FormField name="reason" label="Reason for unlocking" required maxLength={2000} />
      <ErrorAlert error={doUnlock.error} />
      <div>
        <Button type="submit" variant="danger" size="sm" pending={doUnlock.isPending} disabled={!reason.trim()}>
          Unlock version {version}
        </Button>
      </div>
    </Form>
  );
}

function LockForm({ mappingId, versions }: { mappingId: number; versions: VersionSummary[] }) {
  const doLock = useLockMapping(mappingId);
  const form = useZodForm(lockSchema, { version: String(versions[0].number), note: '' });
  const options = versions.map((v) => ({ value: String(v.number), label: `Version ${v.number}${v.message ? ` — ${v.message}` : ''}` }));
  return (
    <Form form={form} serverError={doLock.error} onSubmit={(body) => doLock.mutate(body, { onSuccess: () => form.resetField('note') })} className="flex flex-col gap-2">
      <FormField name="version" label="Version to lock for production" as="select" options={options} />
      <FormField name="note" label="Note (optional)" maxLength={2000} />
      <ErrorAlert error={doLock.error} />
      <div>
        <Button type="submit" size="sm" pending={doLock.isPending}>
          Lock for production
        </Button>
      </div>
    </Form>
  );
}
