import { ButtonLink } from '@/components/ui/button';
import { paths } from '@/config/paths';

export default function NotFoundRoute() {
  return (
    <div className="py-12 text-center">
      <h1 className="text-2xl font-bold">No page here</h1>
      <p className="mt-2">This address does not lead anywhere in Whorlbook. It may have moved, or the link was mistyped.</p>
      <ButtonLink to={paths.home} className="mt-6">
        Back to On the hook
      </ButtonLink>
    </div>
  );
}
