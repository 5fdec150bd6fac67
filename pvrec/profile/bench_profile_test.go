package profile

import (
	"bytes"
	"os"
	"testing"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

var benchSink float64

// BenchmarkDopants: one evaluation of an erfc emitter on a background and of a tabulated
// profile (the J0 solver's inner call). Run with: go test -run NONE -bench . ./pvrec/profile/
func BenchmarkDopants(b *testing.B) {
	raw, err := os.ReadFile("../../testdata/profiles/demo-phosphorus.csv")
	if err != nil {
		b.Fatal(err)
	}
	m, err := ReadCSV(bytes.NewReader(raw))
	if err != nil {
		b.Fatal(err)
	}
	tab, err := m.Profile(silicon.Donor)
	if err != nil {
		b.Fatal(err)
	}
	bg := Uniform{Dopant: silicon.Acceptor, N: 1.5e16}
	for _, tc := range []struct {
		name string
		p    Profile
	}{
		{"erfc", Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.36e-4}, bg}},
		{"tabulated", Sum{tab, bg}},
	} {
		b.Run(tc.name, func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				nd, _, _ := tc.p.Dopants(1e-6 * float64(i%100))
				benchSink += nd
			}
		})
	}
}

// BenchmarkJunctionDepth: the junction search of an erfc emitter and of the demo profile.
func BenchmarkJunctionDepth(b *testing.B) {
	m, err := ReadCSVFile("../../testdata/profiles/demo-phosphorus.csv")
	if err != nil {
		b.Fatal(err)
	}
	tab, _ := m.Profile(silicon.Donor)
	bg := Uniform{Dopant: silicon.Acceptor, N: 1.5e16}
	for _, tc := range []struct {
		name string
		p    Profile
	}{
		{"erfc", Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.36e-4}, bg}},
		{"tabulated", Sum{tab, bg}},
	} {
		b.Run(tc.name, func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				x, err := JunctionDepth(tc.p)
				if err != nil {
					b.Fatal(err)
				}
				benchSink += x
			}
		})
	}
}

// BenchmarkReadCSV: reading the 121-row demo profile.
func BenchmarkReadCSV(b *testing.B) {
	raw, err := os.ReadFile("../../testdata/profiles/demo-phosphorus.csv")
	if err != nil {
		b.Fatal(err)
	}
	for i := 0; i < b.N; i++ {
		if _, err := ReadCSV(bytes.NewReader(raw)); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSheetOf: the sheet resistance of an erfc emitter on a boron wafer with the default
// material (junction search and adaptive integral).
func BenchmarkSheetOf(b *testing.B) {
	mat := materialWith(b, silicon.NewKlaassen1992())
	p := Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}, Uniform{Dopant: silicon.Acceptor, N: 1.5e16}}
	b.ReportAllocs()
	for b.Loop() {
		s, err := SheetOf(p, mat)
		if err != nil {
			b.Fatal(err)
		}
		benchSink += s.Rsh
	}
}
