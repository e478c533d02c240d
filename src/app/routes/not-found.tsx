import { TextLink } from '../../components/ui/text-link';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';

/** Also what a project looks like to someone who is not its member. */
export function NotFoundPage() {
  useDocumentTitle('Not found');
  return (
    <div className="py-16 text-center">
      <svg viewBox="0 0 120 40" aria-hidden="true" className="mx-auto mb-6 h-10">
        <path d="M5 30 C35 5, 85 5, 115 30" fill="none" className="stroke-ink-300" strokeWidth="2" strokeDasharray="4 5" />
        <circle cx="22" cy="18" r="7" className="fill-bead-orange/70" />
        <circle cx="98" cy="18" r="7" className="fill-bead-green/70" />
      </svg>
      <h1 className="text-2xl font-bold text-ink-950">Nothing here</h1>
      <p className="mx-auto mt-2 max-w-md text-ink-700">
        This page does not exist, or it belongs to a project you are not a member of.
      </p>
      <p className="mt-6">
        <TextLink to={paths.projects}>Go to your projects</TextLink>
      </p>
    </div>
  );
}
