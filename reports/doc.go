// Package reports turns computed results into what people and scripts
// read: tables, CSV, JSON, and the rows of the law checks.
//
// # Units
//
// Every named quantity carries its unit in its key, as the command-line
// contract requires: period_s, periapsis_alt_km, inclination_deg,
// speed_periapsis_km_s. Values handed to this package are already in
// those units; reports never converts physics, it only formats.
//
// # Frames
//
// Vectors are printed in the frame their key names (position_km is
// inertial GCRF unless the command says otherwise).
//
// # Conventions
//
// A [Record] is an ordered list of [Field]s; the order is the order of
// JSON keys, CSV columns and table rows. A nil value prints as JSON null,
// an empty CSV cell and "-" in tables. Non-finite numbers are refused
// with [ErrNotFinite]: no NaN or Inf ever reaches the output.
//
// CSV and JSON carry full precision (the shortest representation that
// round-trips a float64); tables round to the digits of each field.
package reports
