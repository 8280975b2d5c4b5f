// Display units and their conversions, apart from the elements: importing this face defines no custom element,
// so screens can format and convert quantities without loading the widgets.
export * from './units';
export * from './in-chosen-units';
