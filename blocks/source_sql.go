package blocks

import (
	"context"
	"crypto/sha256"
	"database/sql"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"sync"
	"time"

	"github.com/jackc/pgx/v5/pgconn"
	"github.com/jackc/pgx/v5/pgtype"
	_ "modernc.org/sqlite" // the pure-Go SQLite driver, registered as "sqlite"
)

// StatementTimeout bounds every statement candor sends to a database: a
// query that runs longer is cancelled and reported as bad input. PostgreSQL
// enforces it on the server (SET LOCAL statement_timeout), SQLite through
// the query's context.
var StatementTimeout = 60 * time.Second

// A SQL source (FORMAT.md section 1: `sqlite: PATH` or `postgres: ENVVAR`
// with a query) is read lazily. Loading it checks the query, learns its
// result columns and their database types and counts its rows, all in a
// read-only transaction; nothing else is read. A block whose analysis can
// run in the database (pushdown.go) sends its grouping and sums there; any
// other block reads the whole result once (sqlSource.rows), and every
// later block shares that read.
//
// Named parameters (`:quarter`) are rewritten to the database's numbered
// placeholders and bound as values; the text of a value never becomes part
// of the SQL.

// dialect is what differs between the two databases.
type dialect struct {
	name string // "sqlite" or "postgres"
}

func (d dialect) pg() bool { return d.name == "postgres" }

// ph is the placeholder for argument n (1-based).
func (d dialect) ph(n int) string {
	if d.pg() {
		return "$" + strconv.Itoa(n)
	}
	return "?" + strconv.Itoa(n)
}

// quoteIdent quotes a column name as an SQL identifier.
func quoteIdent(name string) string {
	return `"` + strings.ReplaceAll(name, `"`, `""`) + `"`
}

// bindParams rewrites every :name outside string literals, quoted
// identifiers and comments to a numbered placeholder of the dialect (the
// same name always gets the same number) and returns the names in
// placeholder order. `::` (a PostgreSQL cast) is left alone. at gives the
// report position of a byte offset of the query for messages.
func bindParams(q string, d dialect, params map[string]string, at func(off int) Pos, what string) (string, []string, error) {
	var b strings.Builder
	var names []string
	num := map[string]int{}
	isName := func(c byte, first bool) bool {
		return c == '_' || c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || !first && c >= '0' && c <= '9' || c >= 0x80
	}
	i := 0
	for i < len(q) {
		c := q[i]
		switch {
		case c == '\'' || c == '"' || c == '`' || (c == '[' && !d.pg()):
			// A string literal or quoted identifier; a doubled quote inside
			// stays inside. PostgreSQL's E'...' strings also escape with \.
			closing := c
			if c == '[' {
				closing = ']'
			}
			backslash := d.pg() && c == '\'' && i > 0 && (q[i-1] == 'E' || q[i-1] == 'e') && (i < 2 || !isName(q[i-2], false))
			j := i + 1
			for j < len(q) {
				if backslash && q[j] == '\\' {
					j += 2
					continue
				}
				if q[j] == closing {
					if closing != ']' && j+1 < len(q) && q[j+1] == closing {
						j += 2
						continue
					}
					break
				}
				j++
			}
			if j >= len(q) {
				j = len(q) - 1
			}
			b.WriteString(q[i : j+1])
			i = j + 1
		case c == '-' && i+1 < len(q) && q[i+1] == '-':
			j := strings.IndexByte(q[i:], '\n')
			if j < 0 {
				j = len(q) - i
			}
			b.WriteString(q[i : i+j])
			i += j
		case c == '/' && i+1 < len(q) && q[i+1] == '*':
			depth, j := 1, i+2
			for j < len(q) && depth > 0 {
				switch {
				case d.pg() && q[j] == '/' && j+1 < len(q) && q[j+1] == '*':
					depth++
					j += 2
				case q[j] == '*' && j+1 < len(q) && q[j+1] == '/':
					depth--
					j += 2
				default:
					j++
				}
			}
			b.WriteString(q[i:j])
			i = j
		case c == '$' && d.pg() && (i == 0 || !isName(q[i-1], false)):
			// A dollar-quoted string, $$...$$ or $tag$...$tag$.
			k := i + 1
			for k < len(q) && isName(q[k], k == i+1) {
				k++
			}
			if k < len(q) && q[k] == '$' {
				tag := q[i : k+1]
				end := strings.Index(q[k+1:], tag)
				stop := len(q)
				if end >= 0 {
					stop = k + 1 + end + len(tag)
				}
				b.WriteString(q[i:stop])
				i = stop
				continue
			}
			b.WriteByte(c)
			i++
		case c == ':' && i+1 < len(q) && q[i+1] == ':':
			b.WriteString("::")
			i += 2
		case c == ':' && i+1 < len(q) && isName(q[i+1], true) && (i == 0 || !isName(q[i-1], false) || q[i-1] == ' '):
			k := i + 1
			for k < len(q) && isName(q[k], false) {
				k++
			}
			name := q[i+1 : k]
			if _, ok := params[name]; !ok {
				hint := Suggest(name, sortedKeys(params))
				if hint == "" {
					hint = "; declare it under params: in the front matter"
				}
				return "", nil, Errorf(at(i), "%s: the query uses :%s, which is no parameter of the report%s", what, name, hint)
			}
			n, seen := num[name]
			if !seen {
				names = append(names, name)
				n = len(names)
				num[name] = n
			}
			b.WriteString(d.ph(n))
			i = k
		default:
			b.WriteByte(c)
			i++
		}
	}
	return b.String(), names, nil
}

// sqlCol is one result column of a SQL source.
type sqlCol struct {
	name   string
	dbType string  // the database's type name, upper case ("" when it has none)
	store  storage // how the database keeps the values
	typ    ColType // the column's type: the source's hint, else from the database type
	hinted bool
	typed  bool // false: the database gives no type, the values decide (SQLite)
}

// storage is the database-side kind of a column, which decides how a
// push-down reads it.
type storage uint8

const (
	storeOther   storage = iota // anything else: read as text
	storeInt                    // integer types
	storeFloat                  // binary floating point (REAL, float8)
	storeDecimal                // exact decimal (PostgreSQL NUMERIC)
	storeText                   // character types
	storeDate                   // a calendar date
	storeBool                   // a boolean
	storeNumeric                // SQLite NUMERIC affinity: integers and reals
)

// sqlSource is the lazy handle of a SQL data set.
type sqlSource struct {
	spec    *SourceSpec
	d       dialect
	target  string // sqlite: the database file; postgres: the connection string
	query   string // with numbered placeholders
	args    []any  // the bound parameter values, in placeholder order
	cols    []sqlCol
	count   int
	queryAt func(off int) Pos

	once sync.Once
	full *Dataset
	err  error

	checkMu sync.Mutex
	checked map[string]bool // SQLite number columns found to hold only numbers
}

// loadSQL opens a SQL source: it binds the parameters, checks the query,
// learns its columns and counts its rows.
func loadSQL(s *SourceSpec, env Env) (*Dataset, error) {
	src := &sqlSource{spec: s, d: dialect{s.Kind}}
	src.queryAt = s.queryPosFunc()
	what := "data " + s.Name
	switch s.Kind {
	case "sqlite":
		path, err := resolveFile(s, env)
		if err != nil {
			return nil, err
		}
		if st, err := os.Stat(path); err == nil && st.IsDir() {
			return nil, Errorf(s.FilePos, "%s: %s is a folder, not a SQLite database file", what, s.File)
		}
		src.target = path
	case "postgres":
		getenv := env.Getenv
		if getenv == nil {
			getenv = os.Getenv
		}
		dsn := getenv(s.EnvVar)
		if dsn == "" {
			return nil, Errorf(s.FilePos, "%s: the environment variable %s is not set; set it to the PostgreSQL connection string (e.g. postgres://user@host:5432/db) before building; the report names only the variable", what, s.EnvVar)
		}
		src.target = dsn
	}
	if w := firstWord(s.Query); w != "SELECT" && w != "WITH" && w != "VALUES" && w != "TABLE" {
		return nil, Errorf(s.QueryPos, "%s: the query must read data (SELECT …, or WITH … SELECT …), and this one starts with %s; candor runs no other statement and reads databases in a read-only transaction", what, w)
	}
	q, names, err := bindParams(trimQuery(s.Query), src.d, env.Params, src.queryAt, what)
	if err != nil {
		return nil, err
	}
	src.query = q
	for _, n := range names {
		src.args = append(src.args, env.Params[n])
	}
	err = src.withConn(func(c sqlConn) error {
		cols, err := c.describe(src.query, src.args)
		if err != nil {
			return src.queryError(c, err, 0)
		}
		return src.learn(c, cols)
	})
	if err != nil {
		return nil, err
	}
	ds := &Dataset{Source: s.Name, File: src.describeFile(), byName: map[string]int{}, sql: src}
	for i, c := range src.cols {
		ds.byName[c.name] = i
	}
	ds.SHA256 = src.queryHash()
	ds.HashOf = "query"
	return ds, nil
}

// firstWord is the query's first keyword, upper case, after white space,
// comments and opening parentheses.
func firstWord(q string) string {
	for {
		q = strings.TrimLeft(q, " \t\r\n(")
		switch {
		case strings.HasPrefix(q, "--"):
			if k := strings.IndexByte(q, '\n'); k >= 0 {
				q = q[k+1:]
				continue
			}
			return ""
		case strings.HasPrefix(q, "/*"):
			if k := strings.Index(q, "*/"); k >= 0 {
				q = q[k+2:]
				continue
			}
			return ""
		}
		break
	}
	end := 0
	for end < len(q) && (q[end] >= 'a' && q[end] <= 'z' || q[end] >= 'A' && q[end] <= 'Z') {
		end++
	}
	return strings.ToUpper(q[:end])
}

// trimQuery drops white space and a final semicolon.
func trimQuery(q string) string {
	q = strings.TrimSpace(q)
	for strings.HasSuffix(q, ";") {
		q = strings.TrimSpace(strings.TrimSuffix(q, ";"))
	}
	return q
}

// queryPosFunc maps a byte offset of the query to the report: exact for a
// query written on one line as a plain scalar, else the query's start.
func (s *SourceSpec) queryPosFunc() func(int) Pos {
	raw := strings.TrimSpace(s.Query)
	lead := len(s.Query) - len(strings.TrimLeft(s.Query, " \t\r\n"))
	return func(off int) Pos {
		if s.QueryPlain && !strings.Contains(raw, "\n") && s.QueryPos.Line > 0 {
			p := s.QueryPos
			p.Col += off + lead
			return p
		}
		return s.QueryPos
	}
}

// describeFile is what the report's footer and messages call the source.
func (src *sqlSource) describeFile() string {
	if src.d.pg() {
		return fmt.Sprintf("PostgreSQL query on $%s", src.spec.EnvVar)
	}
	return fmt.Sprintf("SQLite query on %s", src.spec.File)
}

// queryHash is the SHA-256 of what the data set is before its rows are
// read: the kind and place of the database, the query text, the bound
// parameter values, the result columns with their types and the row count.
func (src *sqlSource) queryHash() string {
	h := sha256.New()
	place := src.spec.File
	if src.d.pg() {
		place = "$" + src.spec.EnvVar
	}
	fmt.Fprintf(h, "%s\x00%s\x00%s\x00", src.d.name, place, src.query)
	for _, a := range src.args {
		fmt.Fprintf(h, "%v\x00", a)
	}
	for _, c := range src.cols {
		fmt.Fprintf(h, "%s\x00%s\x00", c.name, c.dbType)
	}
	fmt.Fprintf(h, "%d", src.count)
	return hex.EncodeToString(h.Sum(nil))
}

// learn types the result columns and counts the rows.
func (src *sqlSource) learn(c sqlConn, cols []colMeta) error {
	s := src.spec
	seen := map[string]int{}
	var names []string
	for i, m := range cols {
		if j, dup := seen[m.name]; dup {
			return Errorf(s.QueryPos, "data %s: the query returns two columns named %q (columns %d and %d); give one another name with AS", s.Name, m.name, j+1, i+1)
		}
		seen[m.name] = i
		names = append(names, m.name)
		sc := sqlCol{name: m.name, dbType: strings.ToUpper(m.dbType)}
		sc.store, sc.typ, sc.typed = src.d.typeOf(sc.dbType)
		if t, ok := s.Types[m.name]; ok {
			sc.typ, sc.hinted, sc.typed = t, true, true
		}
		src.cols = append(src.cols, sc)
	}
	if err := s.checkHints(names); err != nil {
		return err
	}
	// One pass counts the rows and, for SQLite columns without a declared
	// type, which storage classes they hold.
	sel := []string{"COUNT(*)"}
	var probe []int
	for i, sc := range src.cols {
		if !src.d.pg() && sc.dbType == "" {
			q := quoteIdent(sc.name)
			sel = append(sel, fmt.Sprintf("SUM(CASE WHEN typeof(%s) IN ('text','blob') THEN 1 ELSE 0 END)", q))
			probe = append(probe, i)
		}
	}
	q := "SELECT " + strings.Join(sel, ", ") + " FROM (\n" + src.query + "\n) AS candor_q"
	var row []sqlValue
	if err := c.query(q, src.args, func(v []sqlValue) error { row = append([]sqlValue(nil), v...); return nil }); err != nil {
		return src.queryError(c, err, -1)
	}
	if len(row) != len(sel) {
		return Errorf(s.QueryPos, "data %s: the database gave no row count", s.Name)
	}
	n, _ := strconv.Atoi(row[0].text)
	src.count = n
	for k, i := range probe {
		texts, _ := strconv.Atoi(row[k+1].text)
		if texts == 0 && !src.cols[i].hinted {
			// Only numbers (or nothing): a number column, as its values say.
			src.cols[i].store, src.cols[i].typ, src.cols[i].typed = storeNumeric, TypeNumber, true
		}
	}
	return nil
}

// typeOf maps a database type name to its storage and candor type. typed
// is false when the database gives no type and the values must decide.
func (d dialect) typeOf(t string) (storage, ColType, bool) {
	if d.pg() {
		switch strings.ToLower(t) {
		case "int2", "int4", "int8", "oid":
			return storeInt, TypeNumber, true
		case "float4", "float8":
			return storeFloat, TypeNumber, true
		case "numeric":
			return storeDecimal, TypeNumber, true
		case "text", "varchar", "bpchar", "name", "char":
			return storeText, TypeCategory, true
		case "date":
			return storeDate, TypeDate, true
		case "bool":
			return storeBool, TypeBinary, true
		}
		return storeOther, TypeCategory, true
	}
	// SQLite's affinity rules (https://sqlite.org/datatype3.html, 3.1), with
	// dates and booleans named as such.
	switch {
	case t == "":
		return storeOther, TypeCategory, false
	case t == "DATE" || t == "DATETIME" || t == "TIMESTAMP":
		return storeOther, TypeDate, true
	case strings.Contains(t, "BOOL"):
		return storeNumeric, TypeBinary, true
	case strings.Contains(t, "INT"):
		return storeNumeric, TypeNumber, true
	case strings.Contains(t, "CHAR") || strings.Contains(t, "CLOB") || strings.Contains(t, "TEXT"):
		return storeText, TypeCategory, true
	case strings.Contains(t, "BLOB"):
		return storeOther, TypeCategory, true
	}
	return storeNumeric, TypeNumber, true // REAL, FLOAT, DOUBLE, NUMERIC, DECIMAL and the rest
}

// names lists the result columns in query order.
func (src *sqlSource) names() []string {
	out := make([]string, len(src.cols))
	for i, c := range src.cols {
		out[i] = c.name
	}
	return out
}

// rows reads the whole query result once into a data set (every block that
// cannot run in the database shares it). That data set's hash is of the
// rows read; the lazy data set the report lists keeps the query's hash, so
// that its fields never change while blocks run.
func (src *sqlSource) rows() (*Dataset, error) {
	src.once.Do(func() {
		src.full, src.err = src.readAll()
	})
	return src.full, src.err
}

func (src *sqlSource) readAll() (*Dataset, error) {
	s := src.spec
	texts := make([][]string, len(src.cols))
	classes := make([]map[valueKind]int, len(src.cols))
	for i := range classes {
		classes[i] = map[valueKind]int{}
	}
	h := sha256.New()
	err := src.withConn(func(c sqlConn) error {
		return c.query(src.query, src.args, func(row []sqlValue) error {
			if len(row) != len(src.cols) {
				return fmt.Errorf("the query returned %d columns, then %d", len(src.cols), len(row))
			}
			for i, v := range row {
				t := v.text
				if v.null {
					t = ""
					io.WriteString(h, "\x01")
				} else {
					io.WriteString(h, t)
				}
				h.Write([]byte{0})
				texts[i] = append(texts[i], t)
				classes[i][v.kind]++
			}
			h.Write([]byte{'\n'})
			return nil
		})
	})
	if err != nil {
		var be *Error
		if errors.As(err, &be) {
			return nil, err
		}
		return nil, src.plainQueryError(err)
	}
	cols := make([]*Column, len(src.cols))
	for i, sc := range src.cols {
		spec := s
		if !sc.hinted {
			ty := sc.typ
			if !sc.typed {
				// No declared type: numbers when the values are all numbers,
				// else as their text says, as in a CSV file.
				if classes[i][kindText] == 0 {
					ty = TypeNumber
				} else {
					ty = inferType(trimmedCopy(texts[i], s))
				}
			}
			spec = s.withType(sc.name, ty)
		}
		c, err := buildColumn(spec, sc.name, texts[i], func(row int) Pos { return s.QueryPos })
		if err != nil {
			if e, ok := err.(*Error); ok {
				e.Msg += " (row numbers count the query's result rows)"
			}
			return nil, err
		}
		cols[i] = c
	}
	ds := NewDataset(s.Name, src.describeFile(), hex.EncodeToString(h.Sum(nil)), cols)
	ds.HashOf = "rows"
	return ds, nil
}

func trimmedCopy(texts []string, s *SourceSpec) []string {
	out := make([]string, len(texts))
	for i, t := range texts {
		t = strings.TrimSpace(t)
		if s.isMissing(t) {
			t = ""
		}
		out[i] = t
	}
	return out
}

// errStop ends a stream early.
var errStop = errors.New("enough rows")

// colMeta is a result column as the driver describes it.
type colMeta struct {
	name   string
	dbType string
}

// valueKind is the storage class of one value read.
type valueKind uint8

const (
	kindNull valueKind = iota
	kindInt
	kindFloat
	kindText
)

// sqlValue is one value of a result row, as text.
type sqlValue struct {
	text string
	null bool
	kind valueKind
}

// sqlConn is one read-only transaction on a database.
type sqlConn interface {
	// describe returns the result columns of q without reading its rows.
	describe(q string, args []any) ([]colMeta, error)
	// query runs q and calls row for every result row (the slice is reused).
	query(q string, args []any, row func([]sqlValue) error) error
	// stream is query for a result that may be read only in part: row
	// returns errStop to end it, and the rest is never sent.
	stream(q string, args []any, row func([]sqlValue) error) error
	// tables and columns list names for suggestions.
	tables() []string
	columns() []string
	close()
}

// withConn runs f in a read-only transaction with the statement timeout.
func (src *sqlSource) withConn(f func(sqlConn) error) error {
	var c sqlConn
	var err error
	if src.d.pg() {
		c, err = openPostgres(src.target)
	} else {
		c, err = openSQLite(src.target)
	}
	if err != nil {
		return src.connectError(err)
	}
	defer c.close()
	return f(c)
}

func (src *sqlSource) connectError(err error) error {
	s := src.spec
	if src.d.pg() {
		return Errorf(s.FilePos, "data %s: cannot connect to the PostgreSQL server named by $%s: %s; check the connection string and that the server is running", s.Name, s.EnvVar, pgMessage(err))
	}
	return Errorf(s.FilePos, "data %s: cannot open %s as a SQLite database: %v", s.Name, s.File, err)
}

// plainQueryError reports a failed query at the query's position.
func (src *sqlSource) plainQueryError(err error) error {
	s := src.spec
	if errors.Is(err, context.DeadlineExceeded) || isTimeout(err) {
		return Errorf(s.QueryPos, "data %s: the query ran longer than the statement timeout (%s) and was cancelled; make it cheaper (an index, fewer rows) or aggregate in the query", s.Name, StatementTimeout)
	}
	return Errorf(s.QueryPos, "data %s: the query failed: %s", s.Name, dbMessage(err))
}

var quotedName = regexp.MustCompile(`(?:no such (?:table|column): ([^\s,]+))|(?:(?:relation|column) "([^"]+)" does not exist)`)

// queryError reports a failed query with the database's message, its
// position in the report when the database gives one, and the nearest
// names of tables or columns the query may have meant. prefix is the
// number of characters the failed statement has before the query (-1 when
// the query is not at a known place in it).
func (src *sqlSource) queryError(c sqlConn, err error, prefix int) error {
	s := src.spec
	if errors.Is(err, context.DeadlineExceeded) || isTimeout(err) {
		return src.plainQueryError(err)
	}
	msg := dbMessage(err)
	pos := s.QueryPos
	var pe *pgconn.PgError
	if errors.As(err, &pe) && pe.Position > 0 && prefix >= 0 {
		// Map the position back to the query the report holds.
		if off := runeOffset(src.query, int(pe.Position)-1-prefix); off >= 0 {
			pos = src.queryAt(src.originalOffset(off))
		}
	}
	hint := ""
	if m := quotedName.FindStringSubmatch(msg); m != nil {
		name := m[1] + m[2]
		if k := strings.LastIndexByte(name, '.'); k >= 0 {
			name = name[k+1:]
		}
		var cands []string
		if strings.Contains(msg, "table") || strings.Contains(msg, "relation") {
			cands = c.tables()
			if h := Suggest(name, cands); h != "" {
				hint = h
			} else if len(cands) > 0 {
				hint = "; the database has " + strings.Join(cands, ", ")
			}
		} else {
			cands = c.columns()
			hint = Suggest(name, cands)
		}
	}
	return Errorf(pos, "data %s: the query failed: %s%s", s.Name, msg, hint)
}

func runeOffset(s string, n int) int {
	if n < 0 {
		return -1
	}
	k := 0
	for i := range s {
		if k == n {
			return i
		}
		k++
	}
	return -1
}

// originalOffset maps an offset in the rewritten query back to the query as
// written (placeholders are shorter or longer than the names they replace).
func (src *sqlSource) originalOffset(off int) int {
	orig := trimQuery(src.spec.Query)
	i, j := 0, 0 // i in orig, j in rewritten
	for i < len(orig) && j < len(src.query) && j < off {
		if orig[i] == src.query[j] {
			i++
			j++
			continue
		}
		// A :name became $n (or ?n): skip both.
		if orig[i] == ':' {
			i++
			for i < len(orig) && (orig[i] == '_' || orig[i] >= 'a' && orig[i] <= 'z' || orig[i] >= 'A' && orig[i] <= 'Z' || orig[i] >= '0' && orig[i] <= '9') {
				i++
			}
			j++
			for j < len(src.query) && src.query[j] >= '0' && src.query[j] <= '9' {
				j++
			}
			continue
		}
		i++
		j++
	}
	return i
}

func isTimeout(err error) bool {
	var pe *pgconn.PgError
	if errors.As(err, &pe) && pe.Code == "57014" { // query_canceled
		return true
	}
	m := err.Error()
	return strings.Contains(m, "interrupted") || strings.Contains(m, "context deadline exceeded") || strings.Contains(m, "canceling statement due to statement timeout")
}

// dbMessage is the database's own message for a failed statement.
func dbMessage(err error) string {
	var pe *pgconn.PgError
	if errors.As(err, &pe) {
		m := pe.Message
		if pe.Hint != "" {
			m += " (" + pe.Hint + ")"
		}
		return m
	}
	m := err.Error()
	// modernc.org/sqlite: "SQL logic error: no such table: x (1)"
	m = strings.TrimPrefix(m, "SQL logic error: ")
	if k := strings.LastIndex(m, " ("); k > 0 && strings.HasSuffix(m, ")") {
		m = m[:k]
	}
	return m
}

func pgMessage(err error) string {
	var pe *pgconn.PgError
	if errors.As(err, &pe) {
		return pe.Message
	}
	m := err.Error()
	// pgconn's "failed to connect to `user=… database=…`: …" names no secret.
	return m
}

// ---- SQLite ----

type sqliteConn struct {
	db  *sql.DB
	tx  *sql.Tx
	ctx context.Context
	end context.CancelFunc
}

// sqliteURI is the read-only URI of a database file.
func sqliteURI(path string) string {
	abs, err := filepath.Abs(path)
	if err != nil {
		abs = path
	}
	var b strings.Builder
	b.WriteString("file:")
	for i := 0; i < len(abs); i++ {
		c := abs[i]
		if c == '%' || c == '?' || c == '#' || c <= ' ' || c >= 0x7f {
			fmt.Fprintf(&b, "%%%02X", c)
		} else {
			b.WriteByte(c)
		}
	}
	b.WriteString("?mode=ro&_pragma=query_only(1)&_pragma=busy_timeout(5000)")
	return b.String()
}

func openSQLite(path string) (sqlConn, error) {
	db, err := sql.Open("sqlite", sqliteURI(path))
	if err != nil {
		return nil, err
	}
	db.SetMaxOpenConns(1)
	ctx, end := context.WithCancel(context.Background())
	tx, err := db.BeginTx(ctx, &sql.TxOptions{ReadOnly: true})
	if err != nil {
		end()
		db.Close()
		return nil, err
	}
	// A file that is not a database fails only at its first read.
	var n int
	if err := tx.QueryRowContext(ctx, "SELECT COUNT(*) FROM sqlite_master").Scan(&n); err != nil {
		tx.Rollback()
		end()
		db.Close()
		return nil, err
	}
	return &sqliteConn{db: db, tx: tx, ctx: ctx, end: end}, nil
}

func (c *sqliteConn) close() {
	c.tx.Rollback()
	c.end()
	c.db.Close()
}

func (c *sqliteConn) describe(q string, args []any) ([]colMeta, error) {
	ctx, cancel := context.WithTimeout(c.ctx, StatementTimeout)
	defer cancel()
	rows, err := c.tx.QueryContext(ctx, q, args...)
	if err != nil {
		return nil, err
	}
	defer rows.Close()
	cts, err := rows.ColumnTypes()
	if err != nil {
		return nil, err
	}
	out := make([]colMeta, len(cts))
	for i, ct := range cts {
		out[i] = colMeta{name: ct.Name(), dbType: ct.DatabaseTypeName()}
	}
	return out, rows.Err()
}

// sqlTrace, when set (by a benchmark), hears of every statement and its time.
var sqlTrace func(q string, d time.Duration)

func (c *sqliteConn) query(q string, args []any, row func([]sqlValue) error) error {
	if sqlTrace != nil {
		defer func(t time.Time) { sqlTrace(q, time.Since(t)) }(time.Now())
	}
	ctx, cancel := context.WithTimeout(c.ctx, StatementTimeout)
	defer cancel()
	rows, err := c.tx.QueryContext(ctx, q, args...)
	if err != nil {
		return err
	}
	defer rows.Close()
	cols, err := rows.Columns()
	if err != nil {
		return err
	}
	raw := make([]any, len(cols))
	ptrs := make([]any, len(cols))
	for i := range raw {
		ptrs[i] = &raw[i]
	}
	vals := make([]sqlValue, len(cols))
	for rows.Next() {
		if err := rows.Scan(ptrs...); err != nil {
			return err
		}
		for i, r := range raw {
			vals[i] = sqliteValue(r)
		}
		if err := row(vals); err != nil {
			return err
		}
	}
	if err := rows.Err(); err != nil {
		return err
	}
	if ctx.Err() != nil {
		return ctx.Err()
	}
	return nil
}

// sqliteValue writes a driver value as text: integers in full, reals in
// their shortest exact decimal form, dates as ISO text.
func sqliteValue(r any) sqlValue {
	switch v := r.(type) {
	case nil:
		return sqlValue{null: true}
	case int64:
		return sqlValue{text: strconv.FormatInt(v, 10), kind: kindInt}
	case float64:
		return sqlValue{text: floatText(v), kind: kindFloat}
	case bool:
		if v {
			return sqlValue{text: "1", kind: kindInt}
		}
		return sqlValue{text: "0", kind: kindInt}
	case []byte:
		return sqlValue{text: string(v), kind: kindText}
	case string:
		return sqlValue{text: v, kind: kindText}
	case time.Time:
		return sqlValue{text: isoTime(v.UTC()), kind: kindText}
	}
	return sqlValue{text: fmt.Sprint(r), kind: kindText}
}

// floatText is a float's shortest decimal text that reads back to it,
// without an exponent for ordinary magnitudes.
func floatText(f float64) string {
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return strconv.FormatFloat(f, 'g', -1, 64)
	}
	if a := math.Abs(f); a == 0 || (a >= 1e-6 && a < 1e21) {
		return strconv.FormatFloat(f, 'f', -1, 64)
	}
	return strconv.FormatFloat(f, 'g', -1, 64)
}

func (c *sqliteConn) stream(q string, args []any, row func([]sqlValue) error) error {
	err := c.query(q, args, row)
	if err == errStop {
		return nil
	}
	return err
}

func (c *sqliteConn) tables() []string {
	var out []string
	c.query("SELECT name FROM sqlite_master WHERE type IN ('table','view') AND name NOT LIKE 'sqlite_%' ORDER BY name", nil, func(v []sqlValue) error {
		out = append(out, v[0].text)
		return nil
	})
	return out
}

func (c *sqliteConn) columns() []string {
	seen := map[string]bool{}
	var out []string
	for _, t := range c.tables() {
		c.query("SELECT name FROM pragma_table_info(?1)", []any{t}, func(v []sqlValue) error {
			if !seen[v[0].text] {
				seen[v[0].text] = true
				out = append(out, v[0].text)
			}
			return nil
		})
	}
	sort.Strings(out)
	return out
}

// ---- PostgreSQL ----

type pgConn struct {
	conn *pgconn.PgConn
	ctx  context.Context
	end  context.CancelFunc
	tmap *pgtype.Map
}

func openPostgres(dsn string) (sqlConn, error) {
	ctx, end := context.WithCancel(context.Background())
	cctx, cancel := context.WithTimeout(ctx, 30*time.Second)
	defer cancel()
	conn, err := pgconn.Connect(cctx, dsn)
	if err != nil {
		end()
		return nil, err
	}
	c := &pgConn{conn: conn, ctx: ctx, end: end, tmap: pgtype.NewMap()}
	// Read only, and no statement may run longer than the timeout.
	setup := fmt.Sprintf("BEGIN TRANSACTION READ ONLY; SET LOCAL statement_timeout = %d", StatementTimeout.Milliseconds())
	if _, err := conn.Exec(ctx, setup).ReadAll(); err != nil {
		c.close()
		return nil, err
	}
	return c, nil
}

func (c *pgConn) close() {
	ctx, cancel := context.WithTimeout(context.Background(), 5*time.Second)
	defer cancel()
	c.conn.Exec(ctx, "ROLLBACK").ReadAll()
	c.conn.Close(ctx)
	c.end()
}

// pgArgs sends every argument as text: the server reads it as the type the
// statement needs.
func pgArgs(args []any) [][]byte {
	out := make([][]byte, len(args))
	for i, a := range args {
		switch v := a.(type) {
		case nil:
			out[i] = nil
		case string:
			out[i] = []byte(v)
		case float64:
			out[i] = []byte(strconv.FormatFloat(v, 'g', -1, 64))
		case int64:
			out[i] = []byte(strconv.FormatInt(v, 10))
		case int:
			out[i] = []byte(strconv.Itoa(v))
		default:
			out[i] = []byte(fmt.Sprint(v))
		}
	}
	return out
}

func (c *pgConn) describe(q string, args []any) ([]colMeta, error) {
	ctx, cancel := context.WithTimeout(c.ctx, StatementTimeout+5*time.Second)
	defer cancel()
	sd, err := c.conn.Prepare(ctx, "", q, nil)
	if err != nil {
		return nil, err
	}
	out := make([]colMeta, len(sd.Fields))
	for i, f := range sd.Fields {
		name := "unknown"
		if t, ok := c.tmap.TypeForOID(f.DataTypeOID); ok {
			name = t.Name
		}
		out[i] = colMeta{name: f.Name, dbType: name}
	}
	return out, nil
}

func (c *pgConn) query(q string, args []any, row func([]sqlValue) error) error {
	if sqlTrace != nil {
		defer func(t time.Time) { sqlTrace(q, time.Since(t)) }(time.Now())
	}
	ctx, cancel := context.WithTimeout(c.ctx, StatementTimeout+5*time.Second)
	defer cancel()
	rr := c.conn.ExecParams(ctx, q, pgArgs(args), nil, nil, nil)
	fields := rr.FieldDescriptions()
	kinds := make([]valueKind, len(fields))
	bools := make([]bool, len(fields))
	for i, f := range fields {
		kinds[i] = kindText
		if t, ok := c.tmap.TypeForOID(f.DataTypeOID); ok {
			switch t.Name {
			case "int2", "int4", "int8", "oid":
				kinds[i] = kindInt
			case "float4", "float8", "numeric":
				kinds[i] = kindFloat
			case "bool":
				bools[i] = true
			}
		}
	}
	var vals []sqlValue
	var ferr error
	for rr.NextRow() {
		raw := rr.Values()
		if vals == nil {
			vals = make([]sqlValue, len(raw))
		}
		for i, r := range raw {
			switch {
			case r == nil:
				vals[i] = sqlValue{null: true}
			case i < len(bools) && bools[i]:
				t := "false"
				if string(r) == "t" {
					t = "true"
				}
				vals[i] = sqlValue{text: t, kind: kindText}
			default:
				k := kindText
				if i < len(kinds) {
					k = kinds[i]
				}
				vals[i] = sqlValue{text: string(r), kind: k}
			}
		}
		if ferr = row(vals); ferr != nil {
			break
		}
	}
	_, err := rr.Close()
	if ferr != nil {
		return ferr
	}
	return err
}

// stream reads a result through a cursor, a batch at a time, so that a
// result read in part is not sent whole.
func (c *pgConn) stream(q string, args []any, row func([]sqlValue) error) error {
	ctx, cancel := context.WithTimeout(c.ctx, StatementTimeout+5*time.Second)
	defer cancel()
	if err := c.conn.ExecParams(ctx, "DECLARE candor_cursor NO SCROLL CURSOR FOR "+q, pgArgs(args), nil, nil, nil).Read().Err; err != nil {
		return err
	}
	defer func() { c.conn.Exec(ctx, "CLOSE candor_cursor").ReadAll() }()
	for {
		n := 0
		err := c.query("FETCH FORWARD 1000 FROM candor_cursor", nil, func(v []sqlValue) error {
			n++
			return row(v)
		})
		if err == errStop {
			return nil
		}
		if err != nil || n == 0 {
			return err
		}
	}
}

func (c *pgConn) names(q string) []string {
	// The failed statement aborted the transaction: start a new one.
	c.conn.Exec(c.ctx, fmt.Sprintf("ROLLBACK; BEGIN TRANSACTION READ ONLY; SET LOCAL statement_timeout = %d", StatementTimeout.Milliseconds())).ReadAll()
	var out []string
	c.query(q, nil, func(v []sqlValue) error {
		out = append(out, v[0].text)
		return nil
	})
	return out
}

func (c *pgConn) tables() []string {
	return c.names("SELECT DISTINCT table_name::text FROM information_schema.tables WHERE table_schema NOT IN ('pg_catalog','information_schema') ORDER BY 1")
}

func (c *pgConn) columns() []string {
	return c.names("SELECT DISTINCT column_name::text FROM information_schema.columns WHERE table_schema NOT IN ('pg_catalog','information_schema') ORDER BY 1")
}
