import { Link, useParams } from 'react-router-dom';
import { designs, DESIGN_SLUGS, type DesignSlug } from '@benchwright/pricing/geometry';
import { Notice } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { Configurator } from '../../features/configurator/components/configurator';

export function DesignRoute() {
  const { slug = '' } = useParams();
  if (!(DESIGN_SLUGS as readonly string[]).includes(slug))
    return <Notice tone="error">We have no design called “{slug}”.</Notice>;
  const d = designs[slug as DesignSlug];
  return (
    <>
      <p className="mb-2">
        <Link to={paths.home.getHref()} className="text-wood underline">
          ← Our designs
        </Link>
      </p>
      <h1 className="mb-1 text-3xl font-bold">{d.name}</h1>
      <p className="mb-4 text-ink-soft">{d.summary}</p>
      <Configurator key={slug} slug={slug as DesignSlug} />
    </>
  );
}
