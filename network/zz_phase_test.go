package network

import (
	"fmt"
	"os"
	"sort"
	"testing"
	"time"

	"hess/lang"
)

func TestZZPhases(t *testing.T) {
	if os.Getenv("ZZ") == "" {
		t.Skip()
	}
	root, src, _ := synthSource(t, 10000, 50000)
	for it := 0; it < 5; it++ {
		t0 := time.Now()
		n := &Network{Root: root}
		l := &loader{net: n, src: src, index: map[string]int{}}
		l.load(root, nil, lang.Span{})
		t1 := time.Now()
		compile(n)
		t2 := time.Now()
		// per check timing (serial)
		var times []string
		if it == 4 {
			for _, c := range checks {
				if c.Run == nil {
					continue
				}
				var out lang.Diagnostics
				s := time.Now()
				c.Run(&Pass{Net: n, check: c, out: &out})
				times = append(times, fmt.Sprintf("%8.1f ms %s", float64(time.Since(s).Microseconds())/1000, c.Name))
			}
			sort.Strings(times)
		}
		t3 := time.Now()
		runChecks(n)
		t4 := time.Now()
		finalize(n)
		t5 := time.Now()
		fmt.Printf("load %v compile %v checks %v finalize %v\n", t1.Sub(t0), t2.Sub(t1), t4.Sub(t3), t5.Sub(t4))
		for _, s := range times {
			fmt.Println(s)
		}
	}
}

func TestZZCompile(t *testing.T) {
	if os.Getenv("ZZC") == "" {
		t.Skip()
	}
	root, src, _ := synthSource(t, 10000, 50000)
	var files []*File
	{
		n := &Network{Root: root}
		l := &loader{net: n, src: src, index: map[string]int{}}
		l.load(root, nil, lang.Span{})
		files = n.Files
	}
	for it := 0; it < 10; it++ {
		n := &Network{Root: root, Files: files}
		s := time.Now()
		compile(n)
		fmt.Println("compile", time.Since(s))
	}
}
