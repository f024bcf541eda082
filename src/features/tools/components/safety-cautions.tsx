import { Caution } from '@/components/ui/caution';

/**
 * The usual cautions for sharpening on powered wheels and testing edges, shown on every tools
 * page. The tools only compute; the machine's and the wheel's instructions and local regulations
 * decide how to work.
 */
export function SafetyCautions({ className = '' }: { className?: string }) {
  return (
    <div className={className}>
      <Caution title="Before you grind">
        <ul className="list-disc space-y-1 pl-5">
          <li>Wear eye protection whenever a wheel turns.</li>
          <li>A wheel’s rated maximum speed must be higher than the machine’s speed. Check the marking on the wheel.</li>
          <li>Never run a cracked or chipped wheel. Look it over, and stop if it has been dropped.</li>
          <li>Keep the guards on.</li>
          <li>
            Test sharpness with an instrument or a test medium (paper, card, thread), never on skin, and keep fingers
            clear of the edge.
          </li>
          <li>Mind electricity near a water trough: keep cables, plugs and switches dry and away from splashes, and use a residual-current device where the rules call for one.</li>
          <li>Read the safety data sheet of any coolant additive or corrosion inhibitor before use.</li>
          <li>
            The figures here are calculations. Follow the machine’s and the wheel’s instructions and your local
            regulations; where they differ from this page, they decide.
          </li>
        </ul>
      </Caution>
    </div>
  );
}

export default SafetyCautions;
