import { NotFoundPanel } from '@/components/ui/not-found-panel';

export default function NodeNotFound() {
  return <NotFoundPanel what="node" back={{ href: '/fleet', label: 'Back to tonight' }} testId="node-not-found" />;
}
