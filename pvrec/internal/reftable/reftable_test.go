package reftable

import "testing"

func TestLoadCommittedTables(t *testing.T) {
	for _, name := range []string{"fermi_dirac", "cell", "j0_base", "recomb", "surface_sproul"} {
		tab := Load(t, name)
		if len(tab.Header) < 2 || len(tab.Rows) == 0 {
			t.Errorf("%s: header %v, %d rows", name, tab.Header, len(tab.Rows))
		}
	}
	tab := Load(t, "fermi_dirac")
	if Float(t, tab.Rows[0][0]) != -50 {
		t.Errorf("fermi_dirac first eta = %s, want -50", tab.Rows[0][0])
	}
}
