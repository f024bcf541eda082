import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { SafetyCautions } from './safety-cautions';

const TOOLS = [
  {
    href: paths.tools.grit.getHref(),
    name: 'Grit translator',
    what: 'Type a grit in any common standard (FEPA F or P, JIS, ANSI, US mesh, diamond and CBN designations, or micrometres) and see its particle size, its grit band and the nearest grade in every other standard.',
  },
  {
    href: paths.tools.angle.getHref(),
    name: 'Angle geometry',
    what: 'The edge angle a wheel, support bar and projection give (with the jig’s blade-plane offset); the gap for the angle you want; and how far the angle drifts as a vitrified wheel wears smaller.',
  },
  {
    href: paths.tools.sideAngle.getHref(),
    name: 'Flat bevels on a wheel’s side',
    what: 'The angle a bar parallel to the wheel’s face grinds, and the gap for the angle you want, on wheels whose side may be used.',
  },
  {
    href: paths.tools.hardness.getHref(),
    name: 'Hardness converter',
    what: 'Rockwell C, Vickers, Brinell and Rockwell A for steel, from the conversion table for non-austenitic steels, without extrapolating past it.',
  },
  {
    href: paths.workshop.getHref(),
    name: 'My workshop',
    what: 'Your grinders, wheels, jigs and saved setups: the gap to set today on each wheel, rated speeds, what the kit costs per sharpening and where the coolant changes (for members, private).',
  },
  {
    href: paths.tools.wheelLog.getHref(),
    name: 'Wheel log',
    what: 'Your wheels’ measured diameters over time, how fast they wear, and the gap from bar to rim that gives your usual angles today (for members).',
  },
] as const;

/** The tools page: a short guide to each calculator. Everything is computed in the browser. */
export default function ToolsIndex() {
  return (
    <div className="flex flex-col gap-8">
      <PageTitle
        title="Tools"
        lead="Calculators for the numbers that come up at the grinder. They work as you type and send nothing anywhere."
      >
        Tools
      </PageTitle>
      <ul className="grid gap-4 md:grid-cols-2">
        {TOOLS.map((tool) => (
          <li key={tool.href} className="flex flex-col rounded-md border border-rule bg-panel p-4">
            <h2 className="text-xl font-semibold">
              <Link to={tool.href}>{tool.name}</Link>
            </h2>
            <p className="mt-2 text-sm text-muted">{tool.what}</p>
          </li>
        ))}
      </ul>
      <SafetyCautions />
    </div>
  );
}
