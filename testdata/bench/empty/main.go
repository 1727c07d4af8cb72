// Command empty does nothing: compare.py times it as the floor of any Go
// process on the machine (exec, runtime start, exit).
package main

func main() {}
