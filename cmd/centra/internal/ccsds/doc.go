// Package ccsds reads and writes the Orbit Data Messages of CCSDS 502.0-B-2
// (the open standard of the Consultative Committee for Space Data
// Systems) in their keyword = value notation (KVN): the Orbit Parameter
// Message (OPM, one state with optional Keplerian elements and spacecraft
// parameters) and the Orbit Ephemeris Message (OEM, a table of states).
//
// # Units
//
// As the standard prescribes: positions in km, velocities in km/s,
// angles in degrees, GM in km^3/s^2, mass in kg, areas in m^2. A unit
// written in square brackets after a value must be the standard's unit for
// that keyword; anything else is an error.
//
// # Frames
//
// The messages name their frame (REF_FRAME) and time system
// (TIME_SYSTEM); this package reports them as written and leaves the
// conversion to the caller.
//
// # Conventions
//
// Parse errors are [*Error] values carrying the file name and the line
// number. Unknown keywords, duplicate keywords, missing mandatory keywords
// and malformed numbers are rejected; COMMENT lines are kept; maneuver,
// covariance and USER_DEFINED keywords of an OPM are read and kept
// as text (centra does not use them).
package ccsds
