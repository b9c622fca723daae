import { NotFoundPanel } from '@/components/ui/not-found-panel';

export default function SiteNotFound() {
  return <NotFoundPanel what="site" back={{ href: '/sites', label: 'Back to sites' }} testId="site-not-found" />;
}
