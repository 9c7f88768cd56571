import { Link } from 'react-router-dom';
import { designs, DESIGN_SLUGS } from '@benchwright/pricing/geometry';
import { Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';

export function HomeRoute() {
  return (
    <>
      <h1 className="mb-2 text-3xl font-bold">Furniture built for the way you work</h1>
      <p className="mb-6 max-w-2xl text-lg text-ink-soft">
        Pick one of our designs, set it to your space, and and the shop will send you an estimate for it.
      </p>
      <Panel title="Our designs">
        <ul className="grid gap-4 sm:grid-cols-2">
          {DESIGN_SLUGS.map((slug) => (
            <li key={slug} className="rounded border border-rule bg-paper p-4">
              <h3 className="font-semibold">{designs[slug].name}</h3>
              <p className="mb-2 text-ink-soft">{designs[slug].summary}</p>
              <Link
                to={paths.design.getHref(slug)}
                className="font-semibold text-wood underline"
                aria-label={`Configure the ${designs[slug].name.toLowerCase()}`}
              >
                Set it to your space
              </Link>
            </li>
          ))}
        </ul>
        <p className="mt-4">
          Set a design to your space to see its drawing and a budget at once;{' '}
          <Link to={paths.signUp.getHref()} className="text-wood underline">
            create an account
          </Link>{' '}
          to ask for an estimate.
        </p>
      </Panel>
    </>
  );
}
