// Command gen writes docs/model-catalogue.md from the source (run by go generate in
// pvrec/internal/catalogue).
package main

import (
	"log"
	"os"

	"github.com/pvrec/pvrec/pvrec/internal/catalogue"
)

func main() {
	md, err := catalogue.Generate("../..")
	if err != nil {
		log.Fatal(err)
	}
	if err := os.WriteFile("../../../docs/model-catalogue.md", []byte(md), 0o644); err != nil {
		log.Fatal(err)
	}
}
