package blocks

import (
	"sync"

	"github.com/go-gota/gota/dataframe"
	"github.com/go-gota/gota/series"
)

// lazyFrame is a data set's gota frame, built on first use: a column's
// series when a filter first compares on it, the whole frame when someone
// asks for it. Converting a million-row column into gota elements costs
// more than reading it, and most blocks never filter, so a data set builds
// only what its filters touch. Safe for use by concurrent blocks.
type lazyFrame struct {
	once   []sync.Once
	series []series.Series
	whole  sync.Once
	frame  dataframe.DataFrame
}

func newLazyFrame(n int) *lazyFrame {
	return &lazyFrame{once: make([]sync.Once, n), series: make([]series.Series, n)}
}

// Series returns the named column as a gota series (missing values are
// gota's NaN elements), built once per data set; ok is false when the data
// set has no such column.
func (t *Dataset) Series(name string) (s series.Series, ok bool) {
	i, ok := t.byName[name]
	if !ok || i >= len(t.Cols) {
		return series.Series{}, false
	}
	lf := t.lazyFrame()
	lf.once[i].Do(func() { lf.series[i] = toSeries(t.Cols[i]) })
	return lf.series[i], true
}

// Frame returns the data set as a gota data frame, built on first use.
func (t *Dataset) Frame() dataframe.DataFrame {
	lf := t.lazyFrame()
	lf.whole.Do(func() {
		if len(t.Cols) == 0 {
			return
		}
		ss := make([]series.Series, len(t.Cols))
		for i, c := range t.Cols {
			ss[i], _ = t.Series(c.Name)
		}
		lf.frame = dataframe.New(ss...)
	})
	return lf.frame
}

func (t *Dataset) lazyFrame() *lazyFrame {
	t.frameInit.Do(func() { t.frame = newLazyFrame(len(t.Cols)) })
	return t.frame
}
