/** Geometry: design shapes → polygons → the fluid region, and the checks on it. */
export { cosSinDeg } from './angles';
export { ARC_TOLERANCE, arcSegmentCount, arcVertices, circleVertices } from './arc';
export { channelWidths, type ChannelWidths, type WidthSample } from './channel-width';
export { checkGrid, checkRegion, checkShapes, hasDrive, MIN_CELLS_ACROSS, type GridCheckInput } from './checks';
export { fluidRegion, regionFromMultiPolygon, type FluidRegion } from './fluid-region';
export { regionContains } from './region-contains';
export * from './ring';
export { findSelfCrossing, segmentsMeet } from './self-crossing';
export { rectRing, sectorRings, shapeArea, shapeFeatureSize, shapeOutline } from './shape-outline';
