// Command centra plans orbits and suborbital arcs from first principles.
// Run `centra --help` for the commands and `centra demo` for a tour.
package main

import "os"

func main() { os.Exit(run(os.Args, os.Stdout, os.Stderr)) }
