//! The drawing model: one tree of groups, polylines and texts, serialised two ways — as an SVG
//! document (written here, in the layout of the `svg` crate, which an equivalence test keeps) and as a patch list of the values that change with the numbers.
//!
//! Every polyline and text carries a stable key (`data-k`): the set of elements and their keys
//! depend only on which parts exist (rider, cockpit, seat, cranks, handling limits, dimension
//! numbers), never on the numbers themselves. [`Drawing::structure`] names that set, so a page
//! that already shows a drawing of the same structure can apply [`Drawing::patch`] instead of
//! replacing the document.

/// One element of the drawing.
#[derive(Debug, Clone, PartialEq)]
pub enum Node {
    /// A group (`<g class>`), for layers the page shows or hides with classes.
    Group {
        /// The group's classes.
        class: String,
        /// Its elements, back to front.
        children: Vec<Node>,
    },
    /// One styled part: its lines and polylines, each a `<polyline>` with the part's classes
    /// (styled by the page's CSS), and its circles, each a [`Ring`].
    Lines {
        /// The part's classes.
        class: String,
        /// Its polylines, in drawing order.
        lines: Vec<Line>,
    },
    /// A `<text>` label.
    Text {
        /// Stable key (`data-k`).
        key: String,
        /// The text's classes.
        class: String,
        /// `start`, `middle` or `end`.
        anchor: &'static str,
        /// x, 0.1 mm.
        x: String,
        /// y, 0.1 mm.
        y: String,
        /// The words.
        words: String,
    },
}

/// One `<polyline>` of a [`Node::Lines`].
#[derive(Debug, Clone, PartialEq)]
pub struct Line {
    /// Stable key (`data-k`).
    pub key: String,
    /// The `points` text: `x,y` pairs in 0.1 mm numbers, separated by spaces.
    pub points: String,
    /// For a circle: the polyline is its anchor (its centre, twice; class `at`, no stroke) and
    /// the circle is drawn as the anchor's start marker.
    pub ring: Option<Ring>,
}

/// A circle drawn as a marker: `<marker id="ring-…" markerUnits="userSpaceOnUse"
/// overflow="visible"><circle data-k class r/></marker>`, placed just before its anchor
/// polyline (`marker-start`), in the same group so that the group's CSS styles the circle (a
/// marker's content inherits from the marker's own ancestors). In user units of the anchor, the
/// circle's centre is the anchor's first point, so moving the circle changes only the anchor's
/// `points`, never a styled property (`cx`, `cy`, `transform`).
#[derive(Debug, Clone, PartialEq)]
pub struct Ring {
    /// Stable key of the `<circle>` (`data-k`): the anchor's key and `.r`.
    pub key: String,
    /// The radius, 0.1 mm number (0 for a part not drawn).
    pub r: String,
}

/// The `id` of a ring's marker: `ring-` and the anchor's key as it is (keys are unique and hold
/// no spaces, quotes or parentheses, so the id is unique and `url(#…)` needs no escape).
pub fn ring_id(anchor_key: &str) -> String {
    format!("ring-{anchor_key}")
}

/// A whole drawing: the root's view box and title, and its elements back to front.
#[derive(Debug, Clone, PartialEq)]
pub struct Drawing {
    /// `min-x min-y width height`, 0.1 mm numbers: `view` as the attribute. Both are set
    /// together, only by [`crate::drawing_in`] (so they cannot disagree).
    pub(crate) view_box: String,
    /// The view box.
    pub(crate) view: crate::ViewBox,
    /// The title (also the root's `aria-label`).
    pub title: String,
    /// The elements, back to front.
    pub nodes: Vec<Node>,
}

/// The key of the root `<svg>` element in the patch list.
pub const ROOT_KEY: &str = "svg";
/// The key of the `<title>` element in the patch list.
pub const TITLE_KEY: &str = "title";

/// One patch: `(key, attribute, value)`; the attribute `text` means the element's text.
pub type Patch<'a> = (&'a str, &'static str, &'a str);

impl Drawing {
    /// The view box the drawing is in.
    pub fn view(&self) -> crate::ViewBox {
        self.view
    }

    /// The root's `viewBox` attribute: `min-x min-y width height`, 0.1 mm numbers.
    pub fn view_box(&self) -> &str {
        &self.view_box
    }

    /// The SVG document (markup for `innerHTML` or a file), written directly: the layout the
    /// `svg` crate gave it (attributes in name order, one element a line), without its
    /// per-element attribute maps, sorting and trait objects (kilobytes of the page's module).
    pub fn svg(&self) -> String {
        let mut out = String::with_capacity(16 * 1024);
        out.push_str("<svg");
        attr(&mut out, "aria-label", &self.title);
        attr(&mut out, "class", "bike-drawing");
        attr(&mut out, "role", "img");
        attr(&mut out, "viewBox", &self.view_box);
        attr(&mut out, "xmlns", "http://www.w3.org/2000/svg");
        out.push_str(">\n");
        text_element(&mut out, "title", &[("data-k", TITLE_KEY)], &self.title);
        for n in &self.nodes {
            write_node(&mut out, n);
        }
        out.push_str("\n</svg>");
        out
    }

    /// Every value that depends on the numbers, element by element in document order (a ring's
    /// anchor `points` before its circle's `r`, though the circle comes first in the document):
    /// the root's `viewBox` and `aria-label`, the title's text, each polyline's `points`, each
    /// ring's `r`, each text's `x`, `y`, text and `text-anchor` (which changes only when a label
    /// moves to a spot of another kind, [`crate::layout`]: one text restyled). Applying it to a
    /// drawing of the same [`Drawing::structure`] gives this drawing.
    pub fn patch(&self) -> Vec<Patch<'_>> {
        let mut out = vec![
            (ROOT_KEY, "viewBox", self.view_box.as_str()),
            (ROOT_KEY, "aria-label", self.title.as_str()),
            (TITLE_KEY, "text", self.title.as_str()),
        ];
        for n in &self.nodes {
            patch_of(n, &mut out);
        }
        out
    }

    /// A short name of the element set (tags, keys, classes; no numbers, no words): a
    /// 64-bit hash of them ([`NameHash`]), so two drawings that can be patched one into the
    /// other have the same name, and two that cannot differ but for a hash collision.
    pub fn structure(&self) -> String {
        let mut h = NameHash::new();
        for n in &self.nodes {
            shape_of(n, &mut |s| h.eat(s));
        }
        format!("{:016x}", h.finish())
    }
}

/// A hash of a list of names, made on every edit, 8 bytes at a time: each name zero-padded to
/// whole words, then its length (so no two lists run together alike), each word mixed in by a
/// full 64 × 64 → 128-bit multiply folded to 64 bits (every input bit reaches every output
/// bit, as in the wyhash family's mixer; a byte-wise FNV-1a of the same names took twice as
/// long). Stable, with no dependency.
pub(crate) struct NameHash(u64);

impl NameHash {
    /// The hash of no names.
    pub(crate) fn new() -> Self {
        NameHash(0xcbf2_9ce4_8422_2325)
    }

    fn mix(&mut self, w: u64) {
        let m = u128::from(self.0 ^ w) * 0x9e37_79b9_7f4a_7c15_u128;
        // The low and high halves folded together (both casts keep exactly 64 bits).
        self.0 = (m as u64) ^ ((m >> 64) as u64) ^ w.rotate_left(32);
    }

    /// Adds one name.
    pub(crate) fn eat(&mut self, s: &str) {
        let mut words = s.as_bytes().chunks_exact(8);
        for w in words.by_ref() {
            let mut b = [0u8; 8];
            b.copy_from_slice(w);
            self.mix(u64::from_le_bytes(b));
        }
        let mut b = [0u8; 8];
        for (to, from) in b.iter_mut().zip(words.remainder()) {
            *to = *from;
        }
        self.mix(u64::from_le_bytes(b));
        self.mix(s.len() as u64);
    }

    /// The hash.
    pub(crate) fn finish(&self) -> u64 {
        self.0
    }
}

/// Appends ` name="value"` with the value escaped as an attribute's (`&`, `<`, `>`, `"`, `'`),
/// exactly as the `svg` crate wrote it (`&amp;` `&lt;` `&gt;` `&quot;` `&apos;`).
fn attr(out: &mut String, name: &str, value: &str) {
    out.push(' ');
    out.push_str(name);
    out.push_str("=\"");
    escape(out, value, true);
    out.push('"');
}

/// Appends `text` with `&`, `<` and `>` escaped, and with `attribute` also both quotes. The
/// escaped characters are ASCII, so every cut falls on a character boundary.
fn escape(out: &mut String, text: &str, attribute: bool) {
    let mut plain = 0;
    for (i, b) in text.bytes().enumerate() {
        let with = match b {
            b'&' => "&amp;",
            b'<' => "&lt;",
            b'>' => "&gt;",
            b'"' if attribute => "&quot;",
            b'\'' if attribute => "&apos;",
            _ => continue,
        };
        out.push_str(text.get(plain..i).unwrap_or_default());
        out.push_str(with);
        plain = i + 1;
    }
    out.push_str(text.get(plain..).unwrap_or_default());
}

/// Appends an element whose only child is text: `<tag attributes>text</tag>` on one line.
fn text_element(out: &mut String, tag: &str, attributes: &[(&str, &str)], text: &str) {
    out.push('<');
    out.push_str(tag);
    for (name, value) in attributes {
        attr(out, name, value);
    }
    out.push('>');
    escape(out, text, false);
    out.push_str("</");
    out.push_str(tag);
    out.push('>');
}

/// Appends one node's elements, each on a line of its own (a line break before each), in the
/// layout the `svg` crate gave them: attributes in name order, an element without children
/// closed with `/>`, a group's children each on their own line and `</g>` on the next.
fn write_node(out: &mut String, n: &Node) {
    match n {
        Node::Group { class, children } => {
            out.push_str("\n<g");
            attr(out, "class", class);
            out.push('>');
            let empty = out.len();
            for c in children {
                write_node(out, c);
            }
            if out.len() == empty {
                // No element inside: `<g class="…"/>`.
                out.pop();
                out.push_str("/>");
            } else {
                out.push_str("\n</g>");
            }
        }
        Node::Lines { class, lines } => {
            for l in lines {
                write_line(out, class, l);
            }
        }
        Node::Text {
            key,
            class,
            anchor,
            x,
            y,
            words,
        } => {
            out.push('\n');
            let attributes = [
                ("class", class.as_str()),
                ("data-k", key.as_str()),
                ("text-anchor", anchor),
                ("x", x.as_str()),
                ("y", y.as_str()),
            ];
            text_element(out, "text", &attributes, words);
        }
    }
}

/// Appends one polyline of a part (`class`), after its ring's marker when it has one.
fn write_line(out: &mut String, class: &str, l: &Line) {
    let Some(ring) = &l.ring else {
        out.push_str("\n<polyline");
        attr(out, "class", class);
        attr(out, "data-k", &l.key);
        attr(out, "points", &l.points);
        out.push_str("/>");
        return;
    };
    let id = ring_id(&l.key);
    out.push_str("\n<marker");
    attr(out, "id", &id);
    attr(out, "markerUnits", "userSpaceOnUse");
    attr(out, "overflow", "visible");
    out.push_str(">\n<circle");
    attr(out, "class", class);
    attr(out, "data-k", &ring.key);
    attr(out, "r", &ring.r);
    out.push_str("/>\n</marker>\n<polyline");
    attr(out, "class", "at");
    attr(out, "data-k", &l.key);
    attr(out, "marker-start", &format!("url(#{id})"));
    attr(out, "points", &l.points);
    out.push_str("/>");
}

fn patch_of<'a>(n: &'a Node, out: &mut Vec<Patch<'a>>) {
    match n {
        Node::Group { children, .. } => {
            for c in children {
                patch_of(c, out);
            }
        }
        Node::Lines { lines, .. } => {
            for l in lines {
                out.push((l.key.as_str(), "points", l.points.as_str()));
                if let Some(ring) = &l.ring {
                    out.push((ring.key.as_str(), "r", ring.r.as_str()));
                }
            }
        }
        Node::Text {
            key,
            x,
            y,
            words,
            anchor,
            ..
        } => out.extend([
            (key.as_str(), "x", x.as_str()),
            (key, "y", y),
            (key, "text", words),
            (key, "text-anchor", anchor),
        ]),
    }
}

fn shape_of(n: &Node, eat: &mut impl FnMut(&str)) {
    match n {
        Node::Group { class, children } => {
            eat("g");
            eat(class);
            for c in children {
                shape_of(c, eat);
            }
            eat("/g");
        }
        Node::Lines { class, lines } => {
            for l in lines {
                eat(if l.ring.is_some() { "ring" } else { "polyline" });
                eat(&l.key);
                eat(class);
            }
        }
        Node::Text { key, class, .. } => {
            eat("text");
            eat(key);
            eat(class);
        }
    }
}
