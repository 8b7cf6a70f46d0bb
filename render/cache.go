package render

import (
	"bytes"
	"crypto/sha256"
	"encoding/binary"
	"encoding/hex"
	"errors"
	"fmt"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"sort"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"candor/blocks"
	"candor/figures"
)

// Cache reuses what blocks computed and drew in earlier builds. An entry is
// keyed by the content of everything a block's result depends on: the
// block's id and body (Spec.Hash), its data (Dataset.SHA256, with the
// source's description: file, delimiter, column hints, missing tokens), the
// report's parameters, and the program itself (candor's version and the
// identity of the running executable, so that a rebuilt candor never reads
// what an older one wrote). A prose-only edit therefore reuses every block,
// results and drawn figures alike; moving a block only updates its
// position.
//
// A Cache has two layers: the results of this process, in memory (what
// `candor watch` rebuilds from), and a folder on disk (what repeated
// `candor build` runs share). A hit gives the same values as computing
// afresh; the disk layer stores them with an exact binary encoding (floats
// by their bits, nil apart from empty), so a report is byte-identical with
// and without the cache. Nothing about caching ever fails a build: an
// unreadable or damaged entry is computed again.
type Cache struct {
	dir string // "" for memory only

	mu     sync.Mutex
	mem    map[string]*cacheEntry
	bytes  int64 // estimated size of mem
	tick   int64
	stats  CacheStats
	wrote  bool
	pruned time.Time
}

// CacheStats counts what a Cache served.
type CacheStats struct {
	MemoryHits, DiskHits, Misses, DiskWrites int
}

type cacheEntry struct {
	res     *blocks.Result  // as blocks.Run returned it, before draw added figure facts
	fig     *figures.Figure // the drawn figure, when drawn
	drawn   bool            // fig is known (nil for a block without a figure)
	size    int64           // estimated bytes
	used    int64           // tick of the last use
	written bool            // on disk already
}

// Limits of the cache. Entries above diskEntryMax (a scatter of a million
// points) are kept in memory only; the folder is pruned, oldest first,
// when it grows past diskMax.
const (
	memMax       = 1 << 30
	diskEntryMax = 64 << 20
	diskMax      = 512 << 20
	cacheMagic   = "candor-cache 1\n"
)

// NewCache returns a cache kept in memory and, when dir is not empty, in
// that folder (created when first written).
func NewCache(dir string) *Cache {
	return &Cache{dir: dir, mem: map[string]*cacheEntry{}}
}

// Stats reports what the cache served so far.
func (c *Cache) Stats() CacheStats {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.stats
}

// Dir is the cache's folder, "" when it keeps nothing on disk.
func (c *Cache) Dir() string { return c.dir }

var (
	defaultOnce sync.Once
	// DefaultCache is the cache every build uses; nil turns caching off.
	// When first needed it is made from the environment: CANDOR_CACHE=off
	// keeps results in memory only, CANDOR_CACHE=DIR keeps them in DIR,
	// and by default they go to candor/ under the user's cache folder
	// (os.UserCacheDir), never into the report's folder. Test binaries
	// keep them in memory unless CANDOR_CACHE names a folder.
	DefaultCache *Cache
)

func activeCache() *Cache {
	defaultOnce.Do(func() {
		if DefaultCache != nil {
			return
		}
		DefaultCache = NewCache(defaultCacheDir())
	})
	return DefaultCache
}

func defaultCacheDir() string {
	switch v := os.Getenv("CANDOR_CACHE"); v {
	case "off", "0", "false", "none":
		return ""
	case "":
		if testing.Testing() {
			return ""
		}
		d, err := os.UserCacheDir()
		if err != nil {
			return ""
		}
		return filepath.Join(d, "candor")
	default:
		return v
	}
}

var exeOnce sync.Once
var exeID string

// executableID names the running program: its path, size and modification
// time. A rebuilt candor (or test binary) gets another one.
func executableID() string {
	exeOnce.Do(func() {
		p, err := os.Executable()
		if err != nil {
			return
		}
		st, err := os.Stat(p)
		if err != nil {
			return
		}
		exeID = fmt.Sprintf("%s\x00%d\x00%d", p, st.Size(), st.ModTime().UnixNano())
	})
	return exeID
}

// blockKey is the cache key of block i, or "" when its result may not be
// cached (a data set whose content is not hashed, such as a SQL source
// whose rows no block has read yet).
func (r *Report) blockKey(i int) string {
	s := r.Doc.Blocks[i]
	name, err := r.sourceOf(s)
	if err != nil {
		return ""
	}
	t := r.Tables[name]
	src := r.Doc.sourceByName(name)
	if t == nil || src == nil || t.SHA256 == "" || (t.HashOf != "" && t.HashOf != "rows") {
		return ""
	}
	id := executableID()
	if id == "" {
		return ""
	}
	h := sha256.New()
	field := func(parts ...string) {
		for _, p := range parts {
			fmt.Fprintf(h, "%d:%s", len(p), p)
		}
	}
	field(cacheMagic, Version, id, s.Hash, t.SHA256, t.HashOf, t.Source, t.File)
	field(src.Name, src.Kind, src.File, src.Sheet, string(src.Delimiter), src.Query, src.EnvVar)
	hints := make([]string, 0, len(src.Types))
	for k, v := range src.Types {
		hints = append(hints, k+"="+v.String())
	}
	sort.Strings(hints)
	field(hints...)
	field(append([]string{"missing"}, src.Missing...)...)
	field(strconv.Itoa(t.Rows()))
	for _, col := range t.Cols {
		field(col.Name, col.Type.String(), strconv.Itoa(col.Decimals))
	}
	params := r.Doc.ParamMap()
	field("params", strconv.Itoa(len(params)))
	for _, k := range sortedKeys(params) {
		field(k, params[k])
	}
	return hex.EncodeToString(h.Sum(nil))
}

// result returns a copy of the cached result of key for a block at pos,
// or nil.
func (c *Cache) result(key string, pos blocks.Pos) *blocks.Result {
	if c == nil || key == "" {
		return nil
	}
	c.mu.Lock()
	e := c.mem[key]
	if e != nil {
		c.tick++
		e.used = c.tick
		c.stats.MemoryHits++
	}
	c.mu.Unlock()
	if e == nil {
		e = c.readDisk(key)
		c.mu.Lock()
		if e == nil {
			c.stats.Misses++
			c.mu.Unlock()
			return nil
		}
		c.stats.DiskHits++
		c.insert(key, e)
		c.mu.Unlock()
	}
	return copyResult(e.res, pos)
}

// figure returns the drawn figure of key, if the cache has it.
func (c *Cache) figure(key string) (*figures.Figure, bool) {
	if c == nil || key == "" {
		return nil, false
	}
	c.mu.Lock()
	defer c.mu.Unlock()
	if e := c.mem[key]; e != nil && e.drawn {
		return e.fig, true
	}
	return nil, false
}

// putResult keeps a result just computed (a copy, before draw adds to it).
func (c *Cache) putResult(key string, res *blocks.Result) {
	if c == nil || key == "" {
		return
	}
	e := &cacheEntry{res: copyResult(res, res.Pos)}
	c.mu.Lock()
	c.insert(key, e)
	c.mu.Unlock()
}

// putFigure keeps the drawn figure (nil: the block draws none) of a result
// put before, and writes the whole entry to disk.
func (c *Cache) putFigure(key string, f *figures.Figure) {
	if c == nil || key == "" {
		return
	}
	c.mu.Lock()
	e := c.mem[key]
	if e == nil || e.drawn {
		c.mu.Unlock()
		return
	}
	e.fig, e.drawn = f, true
	old := e.size
	e.size = estimateSize(e.res, f)
	c.bytes += e.size - old
	write := c.dir != "" && !e.written && e.size <= diskEntryMax
	if write {
		e.written = true
	}
	c.evict()
	c.mu.Unlock()
	if write {
		if c.writeDisk(key, e) {
			c.mu.Lock()
			c.stats.DiskWrites++
			c.wrote = true
			c.mu.Unlock()
		}
	}
}

// insert adds an entry; c.mu is held.
func (c *Cache) insert(key string, e *cacheEntry) {
	if old := c.mem[key]; old != nil {
		c.bytes -= old.size
	}
	if e.size == 0 {
		e.size = estimateSize(e.res, e.fig)
	}
	c.tick++
	e.used = c.tick
	c.mem[key] = e
	c.bytes += e.size
	c.evict()
}

// evict drops the least recently used entries beyond memMax; c.mu is held.
func (c *Cache) evict() {
	for c.bytes > memMax && len(c.mem) > 1 {
		var oldest string
		var at int64 = math.MaxInt64
		for k, e := range c.mem {
			if e.used < at {
				oldest, at = k, e.used
			}
		}
		c.bytes -= c.mem[oldest].size
		delete(c.mem, oldest)
	}
}

func estimateSize(res *blocks.Result, f *figures.Figure) int64 {
	n := int64(4096 + 96*len(res.Facts))
	if fs := res.Figure; fs != nil {
		n += int64(16*len(fs.Points) + 64*len(fs.Boxes))
		for _, b := range fs.Boxes {
			n += int64(8 * len(b.Outliers))
		}
	}
	for _, t := range res.Tables {
		n += int64(64 * len(t.Rows) * max(1, len(t.Head)))
	}
	if f != nil {
		n += int64(len(f.SVG) + len(f.Desc) + 112*len(f.Geometry.Marks))
	}
	return n
}

// copyResult copies a result so that a build may add facts to it.
func copyResult(res *blocks.Result, pos blocks.Pos) *blocks.Result {
	out := *res
	out.Pos = pos
	out.Facts = make(blocks.Facts, len(res.Facts))
	for k, v := range res.Facts {
		out.Facts[k] = v
	}
	return &out
}

// diskEntry is what one file of the cache folder holds.
type diskEntry struct {
	Result blocks.Result
	Drawn  bool
	Figure *figures.Figure
}

func (c *Cache) path(key string) string {
	return filepath.Join(c.dir, key[:2], key+".bin")
}

func (c *Cache) readDisk(key string) *cacheEntry {
	if c.dir == "" {
		return nil
	}
	p := c.path(key)
	b, err := os.ReadFile(p)
	if err != nil || !bytes.HasPrefix(b, []byte(cacheMagic)) {
		return nil
	}
	var de diskEntry
	if err := decodeValue(b[len(cacheMagic):], reflect.ValueOf(&de).Elem()); err != nil {
		os.Remove(p)
		return nil
	}
	now := time.Now()
	os.Chtimes(p, now, now) // pruning removes the least recently used
	return &cacheEntry{res: &de.Result, fig: de.Figure, drawn: de.Drawn, written: true}
}

func (c *Cache) writeDisk(key string, e *cacheEntry) bool {
	de := diskEntry{Result: *e.res, Drawn: e.drawn, Figure: e.fig}
	buf := []byte(cacheMagic)
	buf, err := encodeValue(buf, reflect.ValueOf(de))
	if err != nil {
		return false
	}
	p := c.path(key)
	if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
		return false
	}
	tmp, err := os.CreateTemp(filepath.Dir(p), ".tmp-*")
	if err != nil {
		return false
	}
	_, err = tmp.Write(buf)
	if cerr := tmp.Close(); err == nil {
		err = cerr
	}
	if err == nil {
		err = os.Rename(tmp.Name(), p)
	}
	if err != nil {
		os.Remove(tmp.Name())
		return false
	}
	return true
}

// prune removes the least recently used files once the folder holds more
// than diskMax bytes. It runs at most once a minute, after a build wrote.
func (c *Cache) prune() {
	if c == nil || c.dir == "" {
		return
	}
	c.mu.Lock()
	if !c.wrote || time.Since(c.pruned) < time.Minute {
		c.mu.Unlock()
		return
	}
	c.wrote, c.pruned = false, time.Now()
	c.mu.Unlock()
	type file struct {
		path string
		size int64
		mod  time.Time
	}
	var files []file
	var total int64
	filepath.WalkDir(c.dir, func(p string, d fs.DirEntry, err error) error {
		if err != nil || d.IsDir() || !strings.HasSuffix(p, ".bin") {
			return nil
		}
		if info, err := d.Info(); err == nil {
			files = append(files, file{p, info.Size(), info.ModTime()})
			total += info.Size()
		}
		return nil
	})
	if total <= diskMax {
		return
	}
	sort.Slice(files, func(i, j int) bool { return files[i].mod.Before(files[j].mod) })
	for _, f := range files {
		if total <= diskMax*3/4 {
			break
		}
		if os.Remove(f.path) == nil {
			total -= f.size
		}
	}
}

// The disk encoding: a value written field by field in declaration order,
// with no names or types (the key names the exact program, hence the exact
// types). Integers are varints, floats their IEEE bits (NaN payloads and
// the sign of zero kept), strings and slices their length first. Slices,
// maps and pointers start with 0 for nil and 1 otherwise, so nil and empty
// stay apart, and a pointer to a zero value stays a pointer. Maps are
// written in sorted key order. Interfaces, funcs, channels and unexported
// fields are refused, and the entry is then simply not cached.

var errNotCacheable = errors.New("render: value cannot be cached")

func encodeValue(b []byte, v reflect.Value) ([]byte, error) {
	switch v.Kind() {
	case reflect.Bool:
		if v.Bool() {
			return append(b, 1), nil
		}
		return append(b, 0), nil
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		return binary.AppendVarint(b, v.Int()), nil
	case reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64, reflect.Uintptr:
		return binary.AppendUvarint(b, v.Uint()), nil
	case reflect.Float32, reflect.Float64:
		return binary.LittleEndian.AppendUint64(b, math.Float64bits(v.Float())), nil
	case reflect.String:
		b = binary.AppendUvarint(b, uint64(v.Len()))
		return append(b, v.String()...), nil
	case reflect.Slice:
		if v.IsNil() {
			return append(b, 0), nil
		}
		b = append(b, 1)
		b = binary.AppendUvarint(b, uint64(v.Len()))
		switch v.Type().Elem().Kind() {
		case reflect.Uint8:
			return append(b, v.Bytes()...), nil
		case reflect.Float64:
			for _, x := range v.Convert(float64s).Interface().([]float64) {
				b = binary.LittleEndian.AppendUint64(b, math.Float64bits(x))
			}
			return b, nil
		}
		for i := 0; i < v.Len(); i++ {
			var err error
			if b, err = encodeValue(b, v.Index(i)); err != nil {
				return nil, err
			}
		}
		return b, nil
	case reflect.Array:
		for i := 0; i < v.Len(); i++ {
			var err error
			if b, err = encodeValue(b, v.Index(i)); err != nil {
				return nil, err
			}
		}
		return b, nil
	case reflect.Map:
		if v.IsNil() {
			return append(b, 0), nil
		}
		if v.Type().Key().Kind() != reflect.String {
			return nil, errNotCacheable
		}
		b = append(b, 1)
		b = binary.AppendUvarint(b, uint64(v.Len()))
		keys := v.MapKeys()
		sort.Slice(keys, func(i, j int) bool { return keys[i].String() < keys[j].String() })
		for _, k := range keys {
			var err error
			if b, err = encodeValue(b, k); err != nil {
				return nil, err
			}
			if b, err = encodeValue(b, v.MapIndex(k)); err != nil {
				return nil, err
			}
		}
		return b, nil
	case reflect.Pointer:
		if v.IsNil() {
			return append(b, 0), nil
		}
		return encodeValue(append(b, 1), v.Elem())
	case reflect.Struct:
		if !allExported(v.Type()) {
			return nil, errNotCacheable
		}
		for i := 0; i < v.NumField(); i++ {
			var err error
			if b, err = encodeValue(b, v.Field(i)); err != nil {
				return nil, err
			}
		}
		return b, nil
	}
	return nil, errNotCacheable
}

var exported sync.Map // reflect.Type → bool

// allExported reports whether every field of a struct type is exported.
func allExported(t reflect.Type) bool {
	if ok, found := exported.Load(t); found {
		return ok.(bool)
	}
	ok := true
	for i := 0; i < t.NumField(); i++ {
		ok = ok && t.Field(i).IsExported()
	}
	exported.Store(t, ok)
	return ok
}

var float64s = reflect.TypeOf([]float64(nil))

type decoder struct {
	b   []byte
	err error
}

var errDamaged = errors.New("render: damaged cache entry")

func (d *decoder) byte() byte {
	if len(d.b) == 0 {
		d.err = errDamaged
		return 0
	}
	c := d.b[0]
	d.b = d.b[1:]
	return c
}

func (d *decoder) uvarint() uint64 {
	x, n := binary.Uvarint(d.b)
	if n <= 0 {
		d.err = errDamaged
		return 0
	}
	d.b = d.b[n:]
	return x
}

func (d *decoder) length() int {
	n := d.uvarint()
	if n > uint64(len(d.b)) { // every element takes at least a byte
		d.err = errDamaged
		return 0
	}
	return int(n)
}

func decodeValue(b []byte, v reflect.Value) error {
	d := &decoder{b: b}
	d.value(v)
	if d.err == nil && len(d.b) != 0 {
		d.err = errDamaged
	}
	return d.err
}

func (d *decoder) value(v reflect.Value) {
	if d.err != nil {
		return
	}
	switch v.Kind() {
	case reflect.Bool:
		v.SetBool(d.byte() == 1)
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		x, n := binary.Varint(d.b)
		if n <= 0 {
			d.err = errDamaged
			return
		}
		d.b = d.b[n:]
		v.SetInt(x)
	case reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64, reflect.Uintptr:
		v.SetUint(d.uvarint())
	case reflect.Float32, reflect.Float64:
		if len(d.b) < 8 {
			d.err = errDamaged
			return
		}
		v.SetFloat(math.Float64frombits(binary.LittleEndian.Uint64(d.b)))
		d.b = d.b[8:]
	case reflect.String:
		n := d.length()
		if d.err == nil {
			v.SetString(string(d.b[:n]))
			d.b = d.b[n:]
		}
	case reflect.Slice:
		if d.byte() == 0 || d.err != nil {
			return
		}
		n := d.length()
		if d.err != nil {
			return
		}
		switch v.Type().Elem().Kind() {
		case reflect.Uint8:
			v.SetBytes(append([]byte(nil), d.b[:n]...))
			d.b = d.b[n:]
			return
		case reflect.Float64:
			if n*8 > len(d.b) {
				d.err = errDamaged
				return
			}
			xs := make([]float64, n)
			for i := range xs {
				xs[i] = math.Float64frombits(binary.LittleEndian.Uint64(d.b[8*i:]))
			}
			d.b = d.b[8*n:]
			v.Set(reflect.ValueOf(xs).Convert(v.Type()))
			return
		}
		s := reflect.MakeSlice(v.Type(), n, n)
		for i := 0; i < n && d.err == nil; i++ {
			d.value(s.Index(i))
		}
		v.Set(s)
	case reflect.Array:
		for i := 0; i < v.Len() && d.err == nil; i++ {
			d.value(v.Index(i))
		}
	case reflect.Map:
		if d.byte() == 0 || d.err != nil {
			return
		}
		n := d.length()
		m := reflect.MakeMapWithSize(v.Type(), n)
		for i := 0; i < n && d.err == nil; i++ {
			k := reflect.New(v.Type().Key()).Elem()
			e := reflect.New(v.Type().Elem()).Elem()
			d.value(k)
			d.value(e)
			m.SetMapIndex(k, e)
		}
		v.Set(m)
	case reflect.Pointer:
		if d.byte() == 0 || d.err != nil {
			return
		}
		p := reflect.New(v.Type().Elem())
		d.value(p.Elem())
		v.Set(p)
	case reflect.Struct:
		if !allExported(v.Type()) {
			d.err = errNotCacheable
			return
		}
		for i := 0; i < v.NumField() && d.err == nil; i++ {
			d.value(v.Field(i))
		}
	default:
		d.err = errNotCacheable
	}
}

// analysisCost ranks analyses by the work they usually take on large data,
// a scatter plot of every row first.
var analysisCost = map[string]int{"regression": 4, "correlation": 4, "trend": 3, "compare": 2, "crosstab": 2, "summary": 1}

// longestFirst orders the blocks for run: the costliest analyses first (so
// that two workers finish together), document order among equals.
func longestFirst(specs []*blocks.Spec) []int {
	order := make([]int, len(specs))
	for i := range order {
		order[i] = i
	}
	sort.SliceStable(order, func(a, b int) bool {
		return analysisCost[specs[order[a]].Analysis] > analysisCost[specs[order[b]].Analysis]
	})
	return order
}
