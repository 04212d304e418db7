import { useState } from 'react';
import { Plus } from 'lucide-react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState, Loading, PageHeader } from '@/components/ui/page';
import { useYarns } from '@/features/yarns/api/get-yarns';
import { useCreateYarn } from '@/features/yarns/api/create-yarn';
import { useUpdateYarn } from '@/features/yarns/api/update-yarn';
import { useDeleteYarn } from '@/features/yarns/api/delete-yarn';
import { YarnForm } from '@/features/yarns/components/yarn-form';
import { YarnTable } from '@/features/yarns/components/yarn-table';
import type { ShelfYarn } from '@/types/api';

/** /yarns — the maker's own yarns, with what is left after the projects that used them. */
export default function YarnShelfRoute() {
  const yarns = useYarns();
  const create = useCreateYarn();
  const update = useUpdateYarn();
  const remove = useDeleteYarn();
  const [editing, setEditing] = useState<ShelfYarn | 'new' | null>(null);
  const [deleting, setDeleting] = useState<ShelfYarn | null>(null);

  const close = () => {
    setEditing(null);
    create.reset();
    update.reset();
  };

  const form =
    editing === 'new' ? (
      <Card className="p-4 sm:p-5">
        <h2 className="mb-3 text-xl font-bold">Add a yarn</h2>
        <YarnForm pending={create.isPending} error={create.error} onCancel={close} onSave={(v) => create.mutate(v, { onSuccess: (y) => (toast.success(`Added ${y.name} to the shelf.`), close()) })} />
      </Card>
    ) : editing ? (
      <Card className="p-4 sm:p-5">
        <h2 className="mb-3 text-xl font-bold">Change {editing.name}</h2>
        <YarnForm
          key={editing.id}
          yarn={editing}
          pending={update.isPending}
          error={update.error}
          onCancel={close}
          onSave={(v) => update.mutate({ id: editing.id, input: v }, { onSuccess: () => close() })}
        />
      </Card>
    ) : null;

  return (
    <>
      <PageHeader
        title="Yarn shelf"
        subtitle="Your own yarns. What is left counts off the yarn your projects used."
        action={
          editing ? null : (
            <Button onClick={() => setEditing('new')}>
              <Plus aria-hidden className="h-5 w-5" /> Add a yarn
            </Button>
          )
        }
      />
      {form ? <div className="mb-6">{form}</div> : null}
      {yarns.isPending ? (
        <Loading label="Opening the shelf…" />
      ) : yarns.data?.length ? (
        <YarnTable
          yarns={yarns.data}
          onEdit={(y) => {
            setEditing(y);
            window.scrollTo?.({ top: 0, behavior: 'smooth' });
          }}
          onDelete={setDeleting}
        />
      ) : !editing ? (
        <EmptyState title="The shelf is empty" action={<Button onClick={() => setEditing('new')}>Add your first yarn</Button>}>
          Add the yarns you have, and pick them when you note a project’s materials.
        </EmptyState>
      ) : null}
      <ConfirmDialog
        open={Boolean(deleting)}
        title={`Take ${deleting?.name ?? 'this yarn'} off the shelf?`}
        confirmLabel="Delete the yarn"
        pending={remove.isPending}
        onCancel={() => setDeleting(null)}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: () => (toast.success(`Removed ${deleting.name}.`), setDeleting(null)) })}
      >
        <p>Projects that used it keep their own note of the yarn.</p>
      </ConfirmDialog>
    </>
  );
}
