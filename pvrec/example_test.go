package pvrec_test

import (
	"errors"
	"fmt"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// One error vocabulary for every package: a model asked outside its validity range answers
// with an error that matches pvrec.ErrOutOfRange, and errors.As gives the argument and range.
func Example_errors() {
	si, err := silicon.DefaultModelSet().At(350) // Richter2012 Auger holds at 290–310 K
	if err != nil {
		fmt.Println(err)
		return
	}
	b, err := recomb.NewBulk(si, 0, 1e16)
	if err != nil {
		fmt.Println(err)
		return
	}
	_, err = b.Lifetime(recomb.NewRichter2012(), 1e15)
	var re *pvrec.RangeError
	if errors.Is(err, pvrec.ErrOutOfRange) && errors.As(err, &re) {
		fmt.Printf("%s: %s = %g %s, valid [%g, %g] %s\n", re.Model, re.Arg, re.Value, re.Unit, re.Min, re.Max, re.Unit)
	}
	// Output:
	// Richter2012: temperature T = 350 K, valid [290, 310] K
}
