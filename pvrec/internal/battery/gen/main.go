// Command gen writes the battery's registry_test.go from the exported API of the numerical
// packages (run by go generate in pvrec/internal/battery).
package main

import (
	"go/format"
	"log"
	"os"

	"github.com/pvrec/pvrec/pvrec/internal/battery"
)

func main() {
	entries, err := battery.List("../..")
	if err != nil {
		log.Fatal(err)
	}
	src, err := format.Source([]byte(battery.Registry(entries)))
	if err != nil {
		log.Fatal(err)
	}
	if err := os.WriteFile("registry_test.go", src, 0o644); err != nil {
		log.Fatal(err)
	}
}
