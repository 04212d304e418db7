import { useEffect, useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { Play, Trash2 } from 'lucide-react';
import { toast } from 'sonner';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { usePattern } from '@/features/patterns/api/get-pattern';
import { useUpdatePattern } from '@/features/patterns/api/update-pattern';
import { useDeletePattern } from '@/features/patterns/api/delete-pattern';
import { PatternEditor } from '@/features/patterns/components/pattern-editor';
import { PatternReadView } from '@/features/patterns/components/pattern-read-view';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState, Loading, PageHeader } from '@/components/ui/page';

export default function PatternEditRoute() {
  const { patternId } = useParams();
  const id = Number(patternId);
  const navigate = useNavigate();
  const pattern = usePattern(id);
  const update = useUpdatePattern();
  const remove = useDeletePattern();
  const [confirming, setConfirming] = useState(false);
  const [deleted, setDeleted] = useState(false);
  // Leave only once the editor is gone, so its unsaved-changes guard does not ask about a deleted pattern.
  useEffect(() => {
    if (deleted) navigate(paths.patterns, { replace: true });
  }, [deleted, navigate]);

  if (
    !Number.isInteger(id) ||
    id <= 0 ||
    (pattern.error instanceof ApiError && (pattern.error.status === 404 || pattern.error.status === 422))
  ) {
    return (
      <EmptyState
        title="That pattern could not be found"
        action={<ButtonLink to={paths.patterns}>Back to your patterns</ButtonLink>}
      >
        It may have been deleted, or it belongs to someone else.
      </EmptyState>
    );
  }
  if (deleted) return <Loading label="Deleting…" />;
  if (pattern.isPending) return <Loading label="Opening the pattern…" />;
  if (pattern.isError)
    return <EmptyState title="The pattern could not be loaded">{pattern.error.message}</EmptyState>;
  const p = pattern.data;

  const start = (
    <ButtonLink to={`${paths.newProject}?patternId=${p.id}`} variant={p.mine ? 'secondary' : 'primary'}>
      <Play aria-hidden className="h-5 w-5" /> Start a project from this pattern
    </ButtonLink>
  );

  return (
    <>
      <PageHeader
        title={p.title}
        subtitle={p.designerCredit ? `by ${p.designerCredit}` : undefined}
        action={start}
      />
      {p.mine ? (
        <PatternEditor
          key={p.id}
          pattern={p}
          onSave={(values) => update.mutateAsync({ id: p.id, ...values })}
          saving={update.isPending}
          saveError={update.error}
          footer={
            <Card className="flex flex-wrap items-center justify-between gap-3">
              <p className="text-sm">Projects started from this pattern keep their own copy of it.</p>
              <Button variant="danger" onClick={() => setConfirming(true)}>
                <Trash2 aria-hidden className="h-5 w-5" /> Delete pattern
              </Button>
            </Card>
          }
        />
      ) : (
        <PatternReadView pattern={p} />
      )}
      <ConfirmDialog
        open={confirming}
        title={`Delete “${p.title}”?`}
        confirmLabel="Delete pattern"
        pending={remove.isPending}
        onCancel={() => setConfirming(false)}
        onConfirm={() =>
          remove.mutate(p.id, {
            onSuccess: () => {
              setConfirming(false);
              toast.success('Pattern deleted.');
              setDeleted(true);
            },
          })
        }
      >
        <p>This cannot be undone. Projects you started from it keep their own pieces and instructions.</p>
      </ConfirmDialog>
    </>
  );
}
