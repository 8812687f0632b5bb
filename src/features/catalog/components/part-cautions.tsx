import { Caution } from '../../../components/ui/caution';

/** The cautions that go with turbocharger hardware; shown on part pages where they matter. */
export function PartCautions({ category }: { category: string }) {
  const rotating = category === 'turbochargers' || category === 'cartridges';
  const hot = rotating || category === 'turbine-housings' || category === 'gaskets-fittings';
  if (!hot && category !== 'gauges-sensors') return null;
  return (
    <div className="grid content-start gap-3">
      <h2 className="text-xl font-bold">Before you fit it</h2>
      {hot && (
        <Caution title="Hot parts">
          Turbine housings and exhaust parts run far above the temperature that burns skin and can ignite fuel or oil. Let the engine
          cool before you work on it.
        </Caution>
      )}
      {rotating && (
        <Caution title="Spinning wheels and oil supply">
          The wheels turn at more than 100,000 rpm: never run the engine with the intake or exhaust open. Fit a clean oil feed and drain,
          prime the bearings with oil before the first start, and have the installation checked by a licensed mechanic.
        </Caution>
      )}
      {rotating && (
        <Caution title="Boost, tuning and the law">
          More boost than the engine’s internals and fuel system can take will damage it. Emissions and road-legality rules differ by
          place: check your local codes before fitting.
        </Caution>
      )}
      {category === 'gauges-sensors' && (
        <Caution title="Fitting sensors">
          Fit sensors with the engine off and cold. Drilling a compressor housing for a speed sensor must be done by a qualified workshop.
        </Caution>
      )}
    </div>
  );
}
