package check

import "strings"

// The word lists the extractor and the rules read. Every list is lower case;
// phrases are words joined by single spaces. They are deliberately plain
// English of the kind a report writer uses, not a general grammar.

// stem reduces a lower-case word to a crude stem so that "renewals",
// "renewed" and "renewal" meet, and "bikes" meets "bike". It is not a
// linguistic stemmer; it only has to make the words of a sentence meet the
// column, group and level names of a block.
func stem(w string) string {
	w = strings.TrimSuffix(w, "'s")
	w = strings.TrimSuffix(w, "’s")
	w = strings.TrimSuffix(w, "'")
	if m, ok := monthStem[w]; ok {
		return m
	}
	switch w {
	case "northern", "southern", "eastern", "western":
		return strings.TrimSuffix(w, "ern")
	}
	if len(w) <= 3 {
		return w
	}
	for _, suf := range []string{"ations", "ation", "ments", "ment", "ings", "ing", "ers", "er", "ed", "als", "al", "ies", "es", "s"} {
		if !strings.HasSuffix(w, suf) || len(w)-len(suf) < 3 {
			continue
		}
		base := w[:len(w)-len(suf)]
		switch suf {
		case "ies":
			base += "y"
		case "es":
			// "classes", "boxes", "branches": the e belongs to the ending;
			// "rates", "minutes": it belongs to the word.
			if !(strings.HasSuffix(base, "s") || strings.HasSuffix(base, "x") || strings.HasSuffix(base, "z") ||
				strings.HasSuffix(base, "ch") || strings.HasSuffix(base, "sh")) {
				base = w[:len(w)-1]
			}
		case "s":
			if strings.HasSuffix(w, "ss") || strings.HasSuffix(w, "us") || strings.HasSuffix(w, "is") {
				continue
			}
		}
		w = base
		break
	}
	if len(w) > 4 && strings.HasSuffix(w, "e") {
		w = w[:len(w)-1]
	}
	return w
}

var monthStem = map[string]string{
	"january": "jan", "february": "feb", "march": "mar", "april": "apr", "may": "may", "june": "jun",
	"july": "jul", "august": "aug", "september": "sep", "sept": "sep", "october": "oct",
	"november": "nov", "december": "dec",
	"jan": "jan", "feb": "feb", "mar": "mar", "apr": "apr", "jun": "jun", "jul": "jul",
	"aug": "aug", "sep": "sep", "oct": "oct", "nov": "nov", "dec": "dec",
}

// months are the words that make a neighbouring number a date.
var months = map[string]bool{
	"january": true, "february": true, "march": true, "april": true, "may": true, "june": true,
	"july": true, "august": true, "september": true, "october": true, "november": true, "december": true,
	"jan": true, "feb": true, "mar": true, "apr": true, "jun": true, "jul": true, "aug": true,
	"sep": true, "sept": true, "oct": true, "nov": true, "dec": true,
	"jan.": true, "feb.": true, "mar.": true, "apr.": true, "jun.": true, "jul.": true, "aug.": true,
	"sep.": true, "sept.": true, "oct.": true, "nov.": true, "dec.": true,
}

// stopWords never link a sentence to a block on their own.
var stopWords = set("a an the of in on at to for and or but by with from into onto over under than then that this these those " +
	"it its is are was were be been being has have had do does did not no nor so as per via vs versus our we us their they them " +
	"he she his her you your i my me which who whom whose what when where why how all any each every some most more less few " +
	"other others such only also just very much many one two three can could may might will would shall should must about " +
	"there here if while whereas after before during since until up down out off new old same n mean median average total overall " +
	"rate share percent per cent point points number count data value values group groups level levels time times report block figure table")

// abbreviations end with a dot that does not end a sentence.
var abbreviations = set("e.g i.e approx vs cf al ca c dr mr mrs ms prof st jr sr fig figs eq eqs vol pp p ed eds est avg incl excl resp dept approx. " +
	"jan feb mar apr jun jul aug sep sept oct nov dec mon tue wed thu fri sat sun a.m p.m u.s u.k no nos nr")

// idNouns before a number make it a name, not a claim ("Store 12",
// "week 3", "Table 2").
var idNouns = set("store stores shop branch site sites station route room ward clinic line bus platform gate unit table tables figure figures fig fig. " +
	"chart section sections chapter page pages p. pp. appendix item items question questions q no. nos. number grade level phase step version " +
	"wave waves week day month year round cohort term semester period session lesson zone region district block plot lot team group class " +
	"form dock aisle floor building bay desk counter stop stand model option plan tier school hub depot office location outlet kiosk " +
	"machine terminal register till panel batch sample trial arm quarter visit footnote note source rule issue ticket id code series season " +
	"episode aged age ages ward wards bed beds lane street road avenue route routes bay booth window hall gp practice v version release " +
	"module unit units cluster sector area weeks waves rounds phases stages rooms grades years #")

// numberWords are the counts written in words. "one" is left out as a count
// (it is a pronoun as often as a number) but kept for fractions.
var numberWords = map[string]float64{
	"zero": 0, "one": 1, "two": 2, "three": 3, "four": 4, "five": 5, "six": 6, "seven": 7, "eight": 8,
	"nine": 9, "ten": 10, "eleven": 11, "twelve": 12, "thirteen": 13, "fourteen": 14, "fifteen": 15,
	"sixteen": 16, "seventeen": 17, "eighteen": 18, "nineteen": 19, "twenty": 20, "thirty": 30,
	"forty": 40, "fifty": 50, "sixty": 60, "seventy": 70, "eighty": 80, "ninety": 90, "hundred": 100,
}

// fractionWords are shares said in words ("a third", "two thirds").
var fractionWords = map[string]float64{
	"half": 2, "halves": 2, "third": 3, "thirds": 3, "quarter": 4, "quarters": 4, "fourth": 4, "fourths": 4,
	"fifth": 5, "fifths": 5, "sixth": 6, "sixths": 6, "tenth": 10, "tenths": 10,
}

// multipleWords are multiples said in one word. The value is the ratio; a
// change word ("doubled") also says the direction.
var multipleWords = map[string]float64{
	"twice": 2, "double": 2, "doubled": 2, "doubles": 2, "doubling": 2,
	"triple": 3, "tripled": 3, "triples": 3, "tripling": 3, "treble": 3, "trebled": 3, "thrice": 3,
	"quadruple": 4, "quadrupled": 4, "quadruples": 4,
	"halved": 0.5, "halves": 0.5, "halving": 0.5,
	"twofold": 2, "threefold": 3, "fourfold": 4, "fivefold": 5, "tenfold": 10,
}

// hedge is how a stated number is to be read (FORMAT.md section 5: "reading
// hedges literally").
type hedge uint8

const (
	hNone     hedge = iota // exact within honest rounding
	hAbout                 // within honest rounding plus aboutTolerance
	hNearly                // a little below, not above
	hOver                  // strictly above
	hAtLeast               // at or above
	hUnder                 // strictly below
	hAtMost                // at or below
	hJustOver              // a little above, not below
	hExactly               // exact within honest rounding, said so
	hRange                 // inside a stated range
)

// hedgePhrases map the words before a number to their reading.
var hedgePhrases = map[string]hedge{
	"about": hAbout, "around": hAbout, "roughly": hAbout, "approximately": hAbout, "approx.": hAbout, "approx": hAbout,
	"some": hAbout, "circa": hAbout, "ca.": hAbout, "~": hAbout, "≈": hAbout, "close to": hAbout, "in the region of": hAbout,
	"on the order of": hAbout, "of about": hAbout, "of around": hAbout, "of roughly": hAbout, "an estimated": hAbout,
	"nearly": hNearly, "almost": hNearly, "just under": hNearly, "just below": hNearly, "just shy of": hNearly,
	"not quite": hNearly, "a little under": hNearly, "a little below": hNearly, "slightly under": hNearly,
	"slightly below": hNearly, "just short of": hNearly, "close on": hNearly,
	"over": hOver, "more than": hOver, "above": hOver, "greater than": hOver, "upwards of": hOver, "in excess of": hOver,
	"exceeding": hOver, "higher than": hOver, "well over": hOver, "well above": hOver, "well in excess of": hOver,
	"beyond": hOver, ">": hOver, "better than": hOver, "larger than": hOver, "longer than": hOver, "later than": hOver,
	"bigger than": hOver, "shorter than": hUnder, "smaller than": hUnder, "earlier than": hUnder,
	"at least": hAtLeast, "no fewer than": hAtLeast, "no less than": hAtLeast, "a minimum of": hAtLeast, "≥": hAtLeast,
	"not less than": hAtLeast, "as many as": hAtLeast, "as much as": hAtLeast,
	"under": hUnder, "below": hUnder, "less than": hUnder, "fewer than": hUnder, "lower than": hUnder, "<": hUnder,
	"well under": hUnder, "well below": hUnder, "short of": hUnder,
	"at most": hAtMost, "no more than": hAtMost, "up to": hAtMost, "a maximum of": hAtMost, "≤": hAtMost,
	"not more than": hAtMost, "as high as": hAtMost, "as little as": hAtMost, "only up to": hAtMost,
	"just over": hJustOver, "just above": hJustOver, "just more than": hJustOver, "a little over": hJustOver,
	"a little above": hJustOver, "slightly over": hJustOver, "slightly above": hJustOver, "slightly more than": hJustOver,
	"just past": hJustOver, "a little more than": hJustOver,
	"exactly": hExactly, "precisely": hExactly, "fully": hExactly, "a full": hExactly, "exactly at": hExactly,
}

// hedgeAfter are the words after a number that hedge it ("40% or more").
var hedgeAfter = map[string]hedge{
	"or more": hAtLeast, "or above": hAtLeast, "or over": hAtLeast, "and over": hAtLeast, "and above": hAtLeast,
	"or higher": hAtLeast, "or longer": hAtLeast, "or later": hAtLeast, "or shorter": hAtMost, "plus": hAtLeast, "or so": hAbout, "or thereabouts": hAbout, "odd": hAbout,
	"or less": hAtMost, "or fewer": hAtMost, "or under": hAtMost, "or below": hAtMost, "or lower": hAtMost,
}

// The tolerances of the hedges, relative to the stated value, on top of
// honest rounding (half a unit of the last digit written):
//
//   - "about" 40%: |true − 40| ≤ rounding + 5% of 40 (so 38 to 42);
//   - "nearly" 40%: 40 − (rounding + 5% of 40) ≤ true ≤ 40 + rounding,
//     a little below and never above (so 37.5 to 40.5);
//   - "just over" 40%: 40 < true ≤ 40 + rounding + 5% of 40;
//   - a number said in words ("twice", "a third", "one in four") is read as
//     "about" with wordTolerance, since words carry no decimals.
//
// These are the project's own reading of plain English, not a published
// standard; they are wide enough that a writer who rounds honestly is never
// told off, and narrow enough that "nearly 1.5 times" for 1.18 is.
const (
	aboutTolerance  = 0.05
	nearlyTolerance = 0.05
	wordTolerance   = 0.10
)

// directionWords are words that describe a change or a comparison: +1 a
// rise or "more", −1 a fall or "less".
var directionWords = map[string]int{
	"rise": 1, "rose": 1, "risen": 1, "rising": 1, "rises": 1,
	"increase": 1, "increased": 1, "increases": 1, "increasing": 1,
	"grow": 1, "grew": 1, "grown": 1, "growing": 1, "grows": 1, "growth": 1,
	"climb": 1, "climbed": 1, "climbs": 1, "climbing": 1,
	"gain": 1, "gained": 1, "gains": 1,
	"jump": 1, "jumped": 1, "jumps": 1,
	"surge": 1, "surged": 1, "surges": 1, "soar": 1, "soared": 1, "soars": 1,
	"rocketed": 1, "spiked": 1, "rebounded": 1, "recovered": 1, "expanded": 1, "widened": 1,
	"upward": 1, "upwards": 1, "uptick": 1, "higher": 1, "greater": 1, "larger": 1, "bigger": 1, "more": 1,
	"longer": 1, "up": 1, "doubled": 1, "tripled": 1, "trebled": 1, "quadrupled": 1, "outperformed": 1,
	"exceeded": 1, "outpaced": 1, "outnumbered": 1, "topped": 1,
	"fall": -1, "fell": -1, "fallen": -1, "falling": -1, "falls": -1,
	"drop": -1, "dropped": -1, "drops": -1, "dropping": -1,
	"decline": -1, "declined": -1, "declines": -1, "declining": -1,
	"decrease": -1, "decreased": -1, "decreases": -1, "decreasing": -1,
	"shrink": -1, "shrank": -1, "shrunk": -1, "shrinking": -1, "shrinks": -1,
	"dip": -1, "dipped": -1, "dips": -1, "slip": -1, "slipped": -1, "slips": -1, "slid": -1, "slide": -1,
	"sank": -1, "sunk": -1, "plunged": -1, "plummeted": -1, "tumbled": -1, "eased": -1, "contracted": -1,
	"narrowed": -1, "downward": -1, "downwards": -1, "downturn": -1, "lower": -1, "less": -1, "fewer": -1,
	"smaller": -1, "shorter": -1, "down": -1, "halved": -1, "trailed": -1, "lagged": -1, "reduction": -1,
	"rarer": -1, "scarcer": -1, "commoner": 1, "heavier": 1, "lighter": -1, "busier": 1, "quieter": -1, "warmer": 1,
	"colder": -1, "cooler": -1, "hotter": 1, "dearer": 1, "costlier": 1, "cheaper": -1, "wider": 1, "narrower": -1,
	"richer": 1, "poorer": -1, "outweighed": 1, "outsold": 1, "outscored": 1, "outgrew": 1, "ahead": 1, "behind": -1,
}

// changeVerbs are direction words that describe a change over time or
// between conditions (not a plain comparative like "higher").
var changeVerbs = set("rise rose risen rising rises increase increased increases increasing grow grew grown growing grows growth " +
	"climb climbed climbs climbing gain gained gains jump jumped jumps surge surged surges soar soared soars rocketed spiked " +
	"rebounded recovered expanded widened upward upwards uptick up doubled tripled trebled quadrupled halved " +
	"fall fell fallen falling falls drop dropped drops dropping decline declined declines declining decrease decreased decreases " +
	"decreasing shrink shrank shrunk shrinking shrinks dip dipped dips slip slipped slips slid slide sank sunk plunged plummeted " +
	"tumbled eased contracted narrowed downward downwards downturn down reduction")

// comparatives compare two groups or a group with a value.
var comparatives = set("higher lower more less fewer greater larger smaller bigger longer shorter outperformed exceeded outpaced " +
	"outnumbered trailed lagged rarer scarcer commoner heavier lighter busier quieter warmer colder cooler hotter dearer " +
	"costlier cheaper wider narrower richer poorer outweighed outsold outscored outgrew")

// changeNouns after a number make it a change or a difference ("a 5%
// increase", "5 points higher", "a gap of 5 points").
var changeNouns = set("higher lower more less fewer greater larger smaller bigger longer shorter increase increases decrease " +
	"decreases rise rises drop drops fall falls gain gains loss losses jump jumps growth decline declines reduction reductions " +
	"improvement improvements gap gaps difference differences lead advantage uplift boost cut cuts change changes swing premium " +
	"shortfall above below up down ahead behind increment climb dip slide")

// changeLead are the words before a number that make it a change ("rose
// 5%", "up by 5 points", "a difference of 5").
var changeLead = set("rise rose risen rising rises increase increased increases increasing grow grew grown growing grows " +
	"climb climbed climbs climbing gain gained gains jump jumped jumps surge surged surges soar soared soars " +
	"fall fell fallen falling falls drop dropped drops dropping decline declined declines declining decrease decreased " +
	"decreases decreasing shrink shrank shrunk shrinking dip dipped slip slipped slid sank plunged tumbled eased " +
	"up down higher lower more less fewer greater larger smaller bigger longer shorter improved improve improves worsened " +
	"reduced reduces reduce cut cuts lifted raised lowered boosted trimmed widened narrowed outperformed trailed exceeded " +
	"beat beats lagged raises lifts boosts lowers trims shaved saves saved added adds")

// negations before a word turn its claim around; the rules that read
// directions and quantifiers leave a negated claim alone.
var negations = set("not no never neither nor without n't cannot didn't don't doesn't wasn't weren't isn't aren't hasn't " +
	"haven't hadn't failed fail rather instead hardly barely")

// clauseWords end a clause, for tying a number to the nearest group name.
var clauseWords = set("and but while whereas against versus vs vs. compared than although though yet whilst with respectively")

func set(words string) map[string]bool {
	m := map[string]bool{}
	for _, w := range strings.Fields(words) {
		m[w] = true
	}
	return m
}
