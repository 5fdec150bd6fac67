package sweep

import (
	"errors"
	"fmt"
	"strings"
	"testing"
)

// TestRunOrder: results and errors come back at their index for any number of workers.
func TestRunOrder(t *testing.T) {
	for _, workers := range []int{0, 1, 2, 3, 64} {
		out, errs := Run(40, workers, func(i int) (int, error) { return i * i, nil })
		if errs != nil || len(out) != 40 {
			t.Fatalf("workers %d: %d results, errs %v", workers, len(out), errs)
		}
		for i, v := range out {
			if v != i*i {
				t.Errorf("workers %d: out[%d] = %d", workers, i, v)
			}
		}
	}
	out, errs := Run(5, 2, func(i int) (int, error) { return i * i, nil })
	if errs != nil || fmt.Sprint(out) != "[0 1 4 9 16]" {
		t.Errorf("Run = %v, %v", out, errs)
	}
	_, errs = Run(3, 0, func(i int) (int, error) {
		if i == 1 {
			return 0, errors.New("boom")
		}
		return i, nil
	})
	if errs == nil || errs[0] != nil || errs[1] == nil || errs[2] != nil {
		t.Errorf("Run errors = %v", errs)
	}
	if out, errs := Run(0, 0, func(int) (int, error) { return 0, nil }); out != nil || errs != nil {
		t.Errorf("empty Run = %v, %v", out, errs)
	}
}

// TestRunPanic: a panicking item becomes that item's error, with the stack; the others finish.
func TestRunPanic(t *testing.T) {
	out, errs := Run(6, 2, func(i int) (float64, error) {
		if i == 4 {
			panic(fmt.Sprintf("bad item %d", i))
		}
		return float64(i), nil
	})
	if errs == nil {
		t.Fatal("no errors")
	}
	for i := range out {
		if i == 4 {
			if errs[i] == nil || !strings.Contains(errs[i].Error(), "item 4 panicked") || !strings.Contains(errs[i].Error(), "goroutine") {
				t.Errorf("errs[4] = %v", errs[i])
			}
			continue
		}
		if errs[i] != nil || out[i] != float64(i) {
			t.Errorf("item %d: %g, %v", i, out[i], errs[i])
		}
	}
	_, errs = Run[int](2, 1, nil)
	if errs == nil || errs[0] == nil || errs[1] == nil {
		t.Errorf("nil f: errs = %v", errs)
	}
}
