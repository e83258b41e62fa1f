//! What every view is handed each frame: the session (the inputs), the engine
//! (the results), and the status line (the last message).

use crate::engine::Engine;
use crate::math::Perm;
use crate::session::Session;

/// Shared state passed to each view's `ui`.
pub struct AppCtx<'a> {
    /// The exploration's inputs.
    pub session: &'a mut Session,
    /// The computation service.
    pub engine: &'a Engine,
    /// The last error or notice shown in the status line.
    pub message: &'a mut Option<String>,
}

/// How many permutations the history remembers.
const HISTORY_LIMIT: usize = 500;

impl AppCtx<'_> {
    /// The current permutation (the identity of S_n if the session holds none).
    pub fn perm(&self) -> Perm {
        current_perm(self.session)
    }

    /// Makes `w` current, recording it in the history and resetting the views' places.
    pub fn go_to(&mut self, w: Perm) {
        go_to(self.session, w);
    }

    /// Shows an error in the status line.
    pub fn report(&mut self, text: impl Into<String>) {
        *self.message = Some(text.into());
    }
}

/// The session's current permutation, or the identity of S_n if it holds none.
pub fn current_perm(session: &Session) -> Perm {
    Perm::from_one_line(&session.current)
        .unwrap_or_else(|_| Perm::identity(session.n.clamp(1, crate::math::MAX_N)))
}

/// Makes `w` current in `session` (see [`AppCtx::go_to`]).
pub fn go_to(session: &mut Session, w: Perm) {
    let line = w.one_line();
    if session.current == line {
        return;
    }
    session.n = w.n();
    session.current = line.clone();
    let keep = (session.history_pos + 1).min(session.history.len());
    session.history.truncate(keep);
    session.history.push(line);
    if session.history.len() > HISTORY_LIMIT {
        let extra = session.history.len() - HISTORY_LIMIT;
        session.history.drain(..extra);
    }
    session.history_pos = session.history.len() - 1;
    session.dreams.index = 0;
    session.words.index = 0;
}

/// Steps through the history by `delta` (-1 back, +1 forward); false at either end.
pub fn step_history(session: &mut Session, delta: isize) -> bool {
    let target = session.history_pos as isize + delta;
    if target < 0 || target as usize >= session.history.len() {
        return false;
    }
    let Some(line) = session.history.get(target as usize).cloned() else {
        return false;
    };
    let Ok(w) = Perm::from_one_line(&line) else {
        return false;
    };
    session.history_pos = target as usize;
    session.n = w.n();
    session.current = line;
    session.dreams.index = 0;
    session.words.index = 0;
    true
}
