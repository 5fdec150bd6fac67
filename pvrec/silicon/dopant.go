package silicon

import "fmt"

// Dopant selects a type of dopant: Donor (n-type) or Acceptor (p-type). The zero value is
// invalid.
type Dopant uint8

const (
	// Donor is a donor (phosphorus, arsenic): it makes silicon n-type.
	Donor Dopant = iota + 1
	// Acceptor is an acceptor (boron): it makes silicon p-type.
	Acceptor
)

// String returns "donor" or "acceptor".
func (d Dopant) String() string {
	switch d {
	case Donor:
		return "donor"
	case Acceptor:
		return "acceptor"
	}
	return fmt.Sprintf("Dopant(%d)", uint8(d))
}
