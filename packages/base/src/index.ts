export { encodeNumber, decodeNumber, encodeArray, decodeArray, type EncodedNumber } from './numberCodec';
export { NeumaierAdder, neumaierSum } from './NeumaierAdder';
export { LoopwiseError, brokenRule, describeValue } from './LoopwiseError';
export { binIndex } from './binIndex';
export { widenColumn, grownCapacity, RowShare } from './columnTables';
export { nearestName } from './nearestName';
export { unknownField } from './unknownField';
