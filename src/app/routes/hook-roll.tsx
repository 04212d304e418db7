import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Plus } from 'lucide-react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState, Loading, PageHeader } from '@/components/ui/page';
import { HookSizeMm } from '@/schemas/hooks';
import { useHookRoll } from '@/features/hooks/api/get-hooks';
import { useAddHook } from '@/features/hooks/api/create-hook';
import { useUpdateHook } from '@/features/hooks/api/update-hook';
import { useDeleteHook } from '@/features/hooks/api/delete-hook';
import { HookForm } from '@/features/hooks/components/hook-form';
import { HookList, hookName } from '@/features/hooks/components/hook-list';
import type { RollHook } from '@/types/hooks';

/** /hooks — the maker's own hooks, smallest first. `?size=2.75` (from a project piece) opens the form at that size. */
export default function HookRollRoute() {
  const [search, setSearch] = useSearchParams();
  const asked = HookSizeMm.safeParse(Number(search.get('size') ?? NaN));
  const startMm = asked.success ? asked.data : undefined;
  const hooks = useHookRoll();
  const add = useAddHook();
  const update = useUpdateHook();
  const remove = useDeleteHook();
  const [editing, setEditing] = useState<RollHook | 'new' | null>(startMm != null ? 'new' : null);
  const [deleting, setDeleting] = useState<RollHook | null>(null);

  const close = () => {
    setEditing(null);
    add.reset();
    update.reset();
    if (search.has('size')) setSearch({}, { replace: true });
  };

  const form =
    editing === 'new' ? (
      <Card className="p-4 sm:p-5">
        <h2 className="mb-3 text-xl font-bold">Add a hook</h2>
        <HookForm
          startMm={startMm}
          pending={add.isPending}
          error={add.error}
          onCancel={close}
          onSave={(v) => add.mutate(v, { onSuccess: (h) => (toast.success(`Added ${hookName(h)} to your hook roll.`), close()) })}
        />
      </Card>
    ) : editing ? (
      <Card className="p-4 sm:p-5">
        <h2 className="mb-3 text-xl font-bold">Change the {hookName(editing)} hook</h2>
        <HookForm
          key={editing.id}
          hook={editing}
          pending={update.isPending}
          error={update.error}
          onCancel={close}
          onSave={(v) => update.mutate({ id: editing.id, input: v }, { onSuccess: (h) => (toast.success(`Saved ${hookName(h)}.`), close()) })}
        />
      </Card>
    ) : null;

  return (
    <>
      <PageHeader
        title="Hook roll"
        subtitle="Your own hooks, smallest first. Each piece of a project checks here for the hook it needs."
        action={
          editing ? null : (
            <Button onClick={() => setEditing('new')}>
              <Plus aria-hidden className="h-5 w-5" /> Add a hook
            </Button>
          )
        }
      />
      {form ? <div className="mb-6">{form}</div> : null}
      {hooks.isPending ? (
        <Loading label="Unrolling your hooks…" />
      ) : hooks.data?.length ? (
        <HookList
          hooks={hooks.data}
          onEdit={(h) => {
            setEditing(h);
            window.scrollTo?.({ top: 0, behavior: 'smooth' });
          }}
          onDelete={setDeleting}
        />
      ) : !editing && hooks.isSuccess ? (
        <EmptyState title="Your hook roll is empty" action={<Button onClick={() => setEditing('new')}>Add your first hook</Button>}>
          Add the hooks you own by their size in mm. Then every piece of a project says whether you already have the hook it needs, before you start.
        </EmptyState>
      ) : null}
      <ConfirmDialog
        open={Boolean(deleting)}
        title={`Take the ${deleting ? hookName(deleting) : ''} hook out of the roll?`}
        confirmLabel="Delete the hook"
        pending={remove.isPending}
        onCancel={() => setDeleting(null)}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: () => (toast.success(`Removed ${hookName(deleting)}.`), setDeleting(null)) })}
      >
        <p>
          {deleting && deleting.quantity > 1 ? `All ${deleting.quantity} of them go. To keep some, change how many instead. ` : ''}
          Projects are not changed; their pieces will say the hook is not in your roll.
        </p>
      </ConfirmDialog>
    </>
  );
}
