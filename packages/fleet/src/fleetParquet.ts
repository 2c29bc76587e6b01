import { parquetWriteBuffer } from 'hyparquet-writer';
import type { FleetResult } from './mergeFleet';

/**
 * The per-file table as Parquet (one row per file and channel): row, file, asset, channel,
 * route, usage, samples, damage per repeat and per unit, life in repeats and service, design service,
 * cycles, warnings (JSON text), key. Written with hyparquet-writer (its default Snappy pages,
 * which Parquet readers read; the tests read the file back with hyparquet).
 */
export function filesParquet(fleet: FleetResult): Uint8Array {
  const f = fleet.files;
  return new Uint8Array(
    parquetWriteBuffer({
      columnData: [
        { name: 'row', data: f.map((r) => r.row), type: 'INT32' },
        { name: 'file', data: f.map((r) => r.file), type: 'STRING' },
        { name: 'asset', data: f.map((r) => r.asset), type: 'STRING' },
        { name: 'channel', data: f.map((r) => r.channel), type: 'STRING' },
        { name: 'route', data: f.map((r) => r.route), type: 'STRING' },
        { name: 'usage', data: f.map((r) => r.usage), type: 'DOUBLE' },
        { name: 'samples', data: f.map((r) => r.samples), type: 'DOUBLE' },
        { name: 'damage_per_repeat', data: f.map((r) => r.damagePerRepeat), type: 'DOUBLE' },
        { name: 'damage_per_unit', data: f.map((r) => r.damagePerUnit), type: 'DOUBLE' },
        { name: 'life_repeats', data: f.map((r) => r.lifeRepeats), type: 'DOUBLE' },
        { name: 'life_service', data: f.map((r) => r.lifeService), type: 'DOUBLE' },
        { name: 'design_service', data: f.map((r) => r.designService), type: 'DOUBLE' },
        { name: 'cycles', data: f.map((r) => r.cycles), type: 'DOUBLE' },
        { name: 'warnings', data: f.map((r) => JSON.stringify(r.warnings)), type: 'STRING' },
        { name: 'key', data: f.map((r) => r.key), type: 'STRING' },
      ],
      kvMetadata: [{ key: 'unit', value: fleet.settings.unit }],
      createdBy: 'loopwise-fleet',
    }),
  );
}

/** The per-asset table as Parquet (one row per asset and channel): the sums over its files. */
export function assetsParquet(fleet: FleetResult): Uint8Array {
  const a = fleet.assets;
  return new Uint8Array(
    parquetWriteBuffer({
      columnData: [
        { name: 'asset', data: a.map((r) => r.asset), type: 'STRING' },
        { name: 'channel', data: a.map((r) => r.channel), type: 'STRING' },
        { name: 'files', data: a.map((r) => r.files), type: 'INT32' },
        { name: 'usage', data: a.map((r) => r.usage), type: 'DOUBLE' },
        { name: 'damage', data: a.map((r) => r.damage), type: 'DOUBLE' },
        { name: 'damage_per_unit', data: a.map((r) => r.damagePerUnit), type: 'DOUBLE' },
        { name: 'life_service', data: a.map((r) => r.lifeService), type: 'DOUBLE' },
      ],
      kvMetadata: [{ key: 'unit', value: fleet.settings.unit }],
      createdBy: 'loopwise-fleet',
    }),
  );
}
