//! The table of a^h_w = DS_h(S_w) that the window and the commands use: read
//! off the class Q_h expanded by Monk's rule
//! ([`crate::hessenberg::class`]), for every h. Transition on values of
//! DS_h ([`crate::hessenberg::table`]) stays as the reference; the two
//! agree for every h with n ≤ 7 (tests). Measured on the default h, release
//! build, 2-core machine: n = 12 in 0.42 s and 44 MB by the class against
//! 3.1 s and 282 MB by DS_h; n = 13 in 2.6 s and 146 MB against 20.3 s and
//! 1.35 GB.

use crate::error::MathResult;
use crate::hessenberg::function::HessenbergFn;
use crate::hessenberg::rows::coefficient_table_by_class;
use crate::hessenberg::table::HessenbergTable;
use crate::progress::Progress;

/// a^h_w for the w of length |h| whose listing index passes `select`, in
/// listing order (lexicographic in one-line notation), zeros included;
/// cancellable, with progress.
///
/// ```
/// use elbowroom_math::{Progress, hessenberg::function::HessenbergFn};
/// use elbowroom_math::hessenberg::coefficients::coefficient_table;
/// // h = (2,3,3): the permutohedral variety of n = 3, class σ_{213} + σ_{132}
/// // (a^h_w is the coefficient of σ_{w0 w})
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let t = coefficient_table(&h, &|_| true, &Progress::new(0)).unwrap();
/// let values: Vec<String> = t.entries.iter().map(|e| format!("{}:{}", e.perm, e.value)).collect();
/// assert_eq!(values, vec!["231:1", "312:1"]);
/// let g = HessenbergFn::new(&[3, 3, 3]).unwrap();
/// let t = coefficient_table(&g, &|_| true, &Progress::new(0)).unwrap();
/// assert_eq!(t.entries.len(), 1); // the flag variety itself: a_{321} = 1
/// ```
pub fn coefficient_table(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
) -> MathResult<HessenbergTable> {
    coefficient_table_by_class(h, select, progress)
}
