import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useCreatePattern } from '@/features/patterns/api/create-pattern';
import { PatternEditor } from '@/features/patterns/components/pattern-editor';
import { PageHeader } from '@/components/ui/page';

export default function PatternNewRoute() {
  const navigate = useNavigate();
  const create = useCreatePattern();
  return (
    <>
      <PageHeader
        title="New pattern"
        subtitle="Type or paste it one round per line; the round table checks each count as you type."
      />
      <PatternEditor
        onSave={(values) => create.mutateAsync(values)}
        onSaved={(p) => navigate(paths.pattern(p.id), { replace: true })}
        saving={create.isPending}
        saveError={create.error}
      />
    </>
  );
}
