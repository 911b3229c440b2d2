import { describe, expect, it } from 'vitest';
import { driverRoles } from '../../../src/engine/features/driver-roles';

describe('driverRoles(names)', () => {
  it('finds the load column and the renewable infeed columns by name, any letter case', () => {
    expect(driverRoles(['Load_Forecast', 'wind_onshore', 'Solar_PV', 'gas_price'])).toEqual({ load: 'Load_Forecast', renewables: ['wind_onshore', 'Solar_PV'] });
    expect(driverRoles(['demand', 'pv'])).toEqual({ load: 'demand', renewables: ['pv'] });
    expect(driverRoles(['consumption_mw', 'renewables_total'])).toEqual({ load: 'consumption_mw', renewables: ['renewables_total'] });
  });

  it('takes the first load-like column as the load and never counts it as renewable', () => {
    expect(driverRoles(['load_a', 'load_b', 'wind'])).toEqual({ load: 'load_a', renewables: ['wind'] });
    // "residual load of wind" names a load: it is not also a renewable
    expect(driverRoles(['wind_load', 'solar'])).toEqual({ load: 'wind_load', renewables: ['solar'] });
  });

  it('gives no load and no renewables for other names', () => {
    expect(driverRoles(['temperature', 'gas'])).toEqual({ load: undefined, renewables: [] });
    expect(driverRoles([])).toEqual({ load: undefined, renewables: [] });
  });
});
