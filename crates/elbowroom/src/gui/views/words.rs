//! Reduced words: the exact count, a paged list with content vectors, the
//! selected word drawn as a wiring diagram whose crossings light up with the
//! letters, and the commutation and braid moves available from it. The lit
//! crossing is a mark for the canvas: an export leaves it out unless asked for.

use super::explain_panel::{ExplainPanel, PanelAction, open_eulerian};
use super::{arrow_step, fetch_ready, figure_look};
use crate::engine::requests::WORD_PAGE;
use crate::engine::{Engine, Fetch, JobKey, Slot};
use crate::figure::look::Look;
use crate::figure::wiring::wiring_scene;
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::files::{Exportable, Exports};
use crate::gui::scene_painter::{self, PaintOptions, halo_color, with_highlight};
use crate::math::Perm;
use crate::math::perms::words::{WordMove, apply_word_move, content, word_moves};
use eframe::egui;
use std::sync::Arc;

/// The word view's UI state.
#[derive(Default)]
pub struct WordsView {
    count: Slot,
    page: Slot,
    /// A word reached by a move that is not on the page shown (shown instead
    /// of the selected one).
    moved_off_page: Option<Vec<usize>>,
    hover_crossing: Option<usize>,
    /// Finds the place of the word reached by a move, to select it there.
    locating: Slot,
    /// The wiring diagram on screen, without the hover highlight, for export,
    /// with the word, n, look and lit crossing it was drawn for.
    wiring_shown: Option<(WiringKey, Arc<Scene>)>,
    /// The same diagram as on screen, lit crossing included, for an export
    /// that keeps the marks.
    wiring_marked: Option<(WiringKey, Arc<Scene>)>,
    /// A move selected another word: the list scrolls to it once.
    scroll_to_selected: bool,
    /// Which word's diagram is on screen, for the export's name.
    shown_name: String,
    /// The panel "a_w from the words of w".
    explain: ExplainPanel,
    /// The selected word's place among the words of the content chosen in
    /// the panel (the list then holds only those).
    filtered_index: usize,
    /// The content the list was last drawn for.
    filter_shown: Option<Vec<usize>>,
}

/// What a wiring diagram is drawn for: the word, n, the look, the lit crossing.
type WiringKey = (Vec<usize>, usize, Look, Option<usize>);

/// Where the selection is: the page of the list shown and the words on it.
struct PageShown<'a> {
    /// The page's number (its first word is the `number * WORD_PAGE`-th).
    number: usize,
    words: &'a [Vec<usize>],
}

impl PageShown<'_> {
    /// The index in the whole list of the `k`-th word on the page.
    fn index_of(&self, k: usize) -> usize {
        self.number * WORD_PAGE + k
    }
}

fn word_text(word: &[usize]) -> String {
    let v: Vec<String> = word.iter().map(|a| a.to_string()).collect();
    v.join(" ")
}

fn content_text(word: &[usize], n: usize, separator: &str) -> String {
    let c: Vec<String> = content(word, n).iter().map(|c| c.to_string()).collect();
    c.join(separator)
}

/// A move's button label and the position of its first letter.
fn move_label(word: &[usize], mv: WordMove) -> (String, usize) {
    match mv {
        WordMove::Commute { at } => (
            format!("commute {} {} at {}", word[at], word[at + 1], at + 1),
            at,
        ),
        WordMove::Braid { at } => (
            format!(
                "braid {} {} {} at {}",
                word[at],
                word[at + 1],
                word[at + 2],
                at + 1
            ),
            at,
        ),
    }
}

impl WordsView {
    /// The figures this view can export: the wiring diagram on screen,
    /// without the lit crossing unless the export asks for it; the panel's
    /// formula as a table figure and as a table.
    pub fn figures(&self, look: &Look) -> Exports {
        let panel = self
            .explain
            .figure(look)
            .map(|(name, s)| (name, Exportable::Figure(s)));
        let table = panel.into_iter().chain(
            self.explain
                .table()
                .map(|(name, t)| (name, Exportable::Table(t))),
        );
        let Some((_, clean)) = &self.wiring_shown else {
            return table.into_iter().collect();
        };
        let marked = self
            .wiring_marked
            .as_ref()
            .map_or_else(|| clean.clone(), |(_, s)| s.clone());
        let item = Exportable::Marked {
            clean: clean.clone(),
            marked,
            marks: "the lit crossing",
        };
        std::iter::once((format!("the {}", self.shown_name), item))
            .chain(table)
            .collect()
    }

    /// Draws the view.
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        self.heading_with_count(ui, ctx.engine, &w);
        let panel = egui::CollapsingHeader::new("a_w from the words of w")
            .default_open(true)
            .show(ui, |ui| self.explain.ui(ui, ctx.engine, &w));
        match panel.body_returned.flatten() {
            Some(PanelAction::GoTo(u)) => ctx.go_to(u),
            Some(PanelAction::Eulerian(c)) => open_eulerian(ctx.session, &c),
            None => {}
        }
        ui.separator();
        let look = figure_look(ctx.session);
        // a content chosen in the panel: the list holds the words of that content only
        let filter = self.explain.filter.clone();
        if self.filter_shown != filter {
            self.filter_shown = filter.clone();
            self.filtered_index = 0;
            self.moved_off_page = None;
            self.locating.clear();
        }
        let (mut index, total) = match &filter {
            Some(c) => (self.filtered_index, self.explain.words_with_content(&w, c)),
            None => (ctx.session.words.index, self.total()),
        };
        self.list_and_word(
            ui,
            ctx.engine,
            &w,
            &look,
            &mut index,
            total,
            filter.as_deref(),
        );
        match &filter {
            Some(_) => self.filtered_index = index,
            None => ctx.session.words.index = index,
        }
    }

    /// The page of the list holding the selection (of every word, or of the
    /// words of `filter`), and the selected word with its diagram and moves.
    #[allow(clippy::too_many_arguments)]
    fn list_and_word(
        &mut self,
        ui: &mut egui::Ui,
        engine: &Engine,
        w: &Perm,
        look: &Look,
        index: &mut usize,
        total: Option<usize>,
        filter: Option<&[usize]>,
    ) {
        let n = w.n();
        self.step_by_arrows(ui, index, total);
        let page_no = *index / WORD_PAGE;
        let key = match filter {
            Some(c) => JobKey::ContentWords(w.clone(), c.to_vec(), page_no),
            None => JobKey::Words(w.clone(), page_no),
        };
        let Some(out) = fetch_ready(ui, &mut self.page, engine, key, |_| {
            "listing reduced words".into()
        }) else {
            return;
        };
        let Some(words) = out.words() else { return };
        if words.is_empty() {
            if *index > 0 {
                *index = 0;
            }
            return;
        }
        let page = PageShown {
            number: page_no,
            words,
        };
        let in_page = (*index - page.index_of(0)).min(words.len() - 1);
        *index = page.index_of(in_page);
        self.locate_moved(engine, w, index, filter);
        let word = self
            .moved_off_page
            .clone()
            .unwrap_or_else(|| words[in_page].clone());
        self.shown_name = match (&self.moved_off_page, filter) {
            (Some(_), _) => format!("wiring diagram of a reduced word of w = {w}"),
            (None, Some(c)) => format!(
                "wiring diagram of word {} of content {c:?} of w = {w}",
                *index + 1
            ),
            (None, None) => format!("wiring diagram of word {} of w = {w}", *index + 1),
        };
        self.page_bar(ui, &page, index, total, filter);
        ui.separator();
        ui.horizontal_top(|ui| {
            self.word_list(ui, &page, in_page, n, index);
            ui.separator();
            ui.vertical(|ui| {
                self.letters(ui, &word);
                ui.label(format!("content ({})", content_text(&word, n, ", ")));
                self.wiring(ui, &word, n, look);
                ui.add_space(6.0);
                self.moves(ui, &word, &page, index, filter);
            });
        });
    }

    /// Once the place of the word reached by a move is found, selects it there
    /// (the page follows).
    fn locate_moved(
        &mut self,
        engine: &Engine,
        w: &Perm,
        index: &mut usize,
        filter: Option<&[usize]>,
    ) {
        let Some(word) = self.moved_off_page.clone() else {
            self.locating.clear();
            return;
        };
        let key = match filter {
            Some(c) => JobKey::ContentWordRank(w.clone(), c.to_vec(), word),
            None => JobKey::WordRank(w.clone(), word),
        };
        match self.locating.fetch(engine, key) {
            Fetch::Ready(out) => {
                if let Some(rank) = out.count().and_then(|c| usize::try_from(c).ok()) {
                    self.select(index, rank);
                    self.scroll_to_selected = true;
                }
            }
            // a word of another permutation (w changed meanwhile), or canceled
            Fetch::Failed(_) => self.moved_off_page = None,
            Fetch::Running(..) => {}
        }
    }

    /// Selects the word at `to` in the whole list.
    fn select(&mut self, index: &mut usize, to: usize) {
        *index = to;
        self.moved_off_page = None;
    }

    /// The heading, with the number of reduced words once counted.
    fn heading_with_count(&mut self, ui: &mut egui::Ui, engine: &Engine, w: &Perm) {
        ui.horizontal(|ui| {
            ui.heading(format!("Reduced words of w = {w}"));
            ui.separator();
            match self.count.fetch(engine, JobKey::WordCount(w.clone())) {
                Fetch::Ready(out) => {
                    if let Some(c) = out.count() {
                        ui.label(egui::RichText::new(format!("{c} reduced words")).strong());
                    }
                }
                Fetch::Running(..) => {
                    ui.spinner();
                }
                Fetch::Failed(e) => {
                    ui.colored_label(crate::gui::theme::alert(), e.to_string());
                }
            }
        });
    }

    /// The number of reduced words, once counted (the latest count received).
    fn total(&self) -> Option<usize> {
        self.count
            .latest()
            .and_then(|o| o.count())
            .and_then(|c| usize::try_from(c).ok())
    }

    /// Moves the selection by the arrow keys pressed, within the count.
    fn step_by_arrows(&mut self, ui: &egui::Ui, index: &mut usize, total: Option<usize>) {
        let step = arrow_step(ui);
        if step != 0 {
            self.moved_off_page = None;
            *index = index.saturating_add_signed(step);
            if let Some(t) = total {
                *index = (*index).min(t.saturating_sub(1));
            }
        }
    }

    /// "< page", which words the page holds and which is selected, "page >".
    fn page_bar(
        &mut self,
        ui: &mut egui::Ui,
        page: &PageShown,
        index: &mut usize,
        total: Option<usize>,
        filter: Option<&[usize]>,
    ) {
        ui.horizontal(|ui| {
            if ui
                .add_enabled(page.number > 0, egui::Button::new("< page"))
                .clicked()
            {
                self.select(index, (page.number - 1) * WORD_PAGE);
            }
            let shown_to = page.index_of(page.words.len());
            let selected = if self.moved_off_page.is_some() {
                "the word the move reached (finding its place in the list)".to_string()
            } else {
                (*index + 1).to_string()
            };
            let of = match (filter, total) {
                (Some(c), Some(t)) => format!(" of the {t} of content {c:?}"),
                (Some(c), None) => format!(" of content {c:?}"),
                (None, _) => String::new(),
            };
            ui.label(format!(
                "words {}–{}{of} (lexicographic); selected {selected}",
                page.index_of(0) + 1,
                shown_to,
            ));
            let more = page.words.len() == WORD_PAGE && total.is_none_or(|t| shown_to < t);
            if ui.add_enabled(more, egui::Button::new("page >")).clicked() {
                self.select(index, (page.number + 1) * WORD_PAGE);
            }
        });
    }

    /// The page's words with their content vectors, drawn virtually; a click selects.
    fn word_list(
        &mut self,
        ui: &mut egui::Ui,
        page: &PageShown,
        in_page: usize,
        n: usize,
        index: &mut usize,
    ) {
        // the page holds the words of the content chosen in the panel, if one is
        let shown: Vec<usize> = (0..page.words.len()).collect();
        ui.vertical(|ui| {
            ui.set_width(260.0);
            ui.weak("word · content");
            let row_h = ui.spacing().interact_size.y;
            let mut list = egui::ScrollArea::vertical()
                .id_salt("word_list")
                .max_height(ui.available_height() - 4.0);
            if std::mem::take(&mut self.scroll_to_selected) {
                // the selected row a few rows from the top
                let step = row_h + ui.spacing().item_spacing.y;
                let at = shown.iter().position(|&r| r == in_page).unwrap_or(0);
                list = list.vertical_scroll_offset(at.saturating_sub(3) as f32 * step);
            }
            list.show_rows(ui, row_h, shown.len(), |ui, rows| {
                for r in rows.map(|k| shown[k]) {
                    let wd = &page.words[r];
                    let text = egui::RichText::new(format!(
                        "{}   ({})",
                        word_text(wd),
                        content_text(wd, n, ",")
                    ))
                    .monospace();
                    let selected = r == in_page && self.moved_off_page.is_none();
                    if ui.selectable_label(selected, text).clicked() {
                        self.select(index, page.index_of(r));
                    }
                }
            });
        });
    }

    /// The letters of the word, in step with the crossings: hovering one lights both.
    fn letters(&mut self, ui: &mut egui::Ui, word: &[usize]) {
        ui.horizontal_wrapped(|ui| {
            ui.label("word");
            for (k, a) in word.iter().enumerate() {
                let lit = self.hover_crossing == Some(k);
                let r = ui
                    .selectable_label(lit, egui::RichText::new(a.to_string()).monospace().strong());
                if r.hovered() {
                    self.hover_crossing = Some(k);
                }
            }
        });
    }

    /// The wiring diagram, with the hovered crossing lit.
    fn wiring(&mut self, ui: &mut egui::Ui, word: &[usize], n: usize, look: &Look) {
        let scene = wiring_scene(word, n, look, self.hover_crossing);
        let clean_key: WiringKey = (word.to_vec(), n, *look, None);
        if self
            .wiring_shown
            .as_ref()
            .is_none_or(|(k, _)| *k != clean_key)
        {
            self.wiring_shown = Some((clean_key, Arc::new(wiring_scene(word, n, look, None))));
        }
        let lit_key: WiringKey = (word.to_vec(), n, *look, self.hover_crossing);
        if self
            .wiring_marked
            .as_ref()
            .is_none_or(|(k, _)| *k != lit_key)
        {
            let lit: Vec<Tag> = self.hover_crossing.map(Tag::Crossing).into_iter().collect();
            let marked = with_highlight(&scene, &lit, halo_color(look));
            self.wiring_marked = Some((lit_key, Arc::new(marked)));
        }
        let avail = ui.available_size();
        let opts = PaintOptions {
            highlight: self.hover_crossing.map(Tag::Crossing).into_iter().collect(),
            max_scale: 3.0,
            size: Some(egui::vec2(avail.x, (avail.y * 0.6).max(120.0))),
        };
        let r = scene_painter::show(ui, &scene, &opts);
        if let Some(Tag::Crossing(k)) = r.hovered_where(|t| matches!(t, Tag::Crossing(_))) {
            self.hover_crossing = Some(k);
        } else if r.response.hovered() {
            self.hover_crossing = None;
        }
    }

    /// A button per commutation or braid move from the word; a click applies it.
    fn moves(
        &mut self,
        ui: &mut egui::Ui,
        word: &[usize],
        page: &PageShown,
        index: &mut usize,
        filter: Option<&[usize]>,
    ) {
        ui.label(egui::RichText::new("moves from this word").weak());
        let moves = word_moves(word);
        if moves.is_empty() {
            ui.weak("none: this is the only reduced word");
        }
        ui.horizontal_wrapped(|ui| {
            for mv in moves {
                let (label, at) = move_label(word, mv);
                let r = ui.button(label);
                if r.hovered() {
                    self.hover_crossing = Some(at);
                }
                if r.clicked()
                    && let Ok(next) = apply_word_move(word, mv)
                {
                    // a braid move changes the content: the list is then the whole one
                    if filter.is_some_and(|c| content(&next, c.len() + 1) != c) {
                        // found in the whole list from the next frame on
                        self.explain.filter = None;
                        self.filter_shown = None;
                        self.moved_off_page = Some(next);
                        self.scroll_to_selected = true;
                    } else {
                        self.show_moved(next, page, index);
                    }
                }
            }
        });
    }

    /// Shows the word a move reached: selected in the list if it is on this
    /// page, else shown in place of the selection.
    fn show_moved(&mut self, next: Vec<usize>, page: &PageShown, index: &mut usize) {
        match page.words.iter().position(|x| *x == next) {
            Some(k) => self.select(index, page.index_of(k)),
            None => self.moved_off_page = Some(next),
        }
        self.scroll_to_selected = true;
    }
}

impl super::View for WordsView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Words
    }

    fn title(&self) -> &'static str {
        "Reduced words & wiring"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }

    fn exports(&mut self, session: &crate::session::Session) -> crate::gui::files::Exports {
        self.figures(&figure_look(session))
    }
}
