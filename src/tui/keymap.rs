//! The key map: the shared bindings (everywhere, at the top of every view, moving, editing,
//! the overlays) live here; each view declares its own in a table beside its code
//! ([`super::views::View::keys`]). The footer and the help overlay are generated from these
//! tables, so they cannot disagree with what keys do.

pub use super::key::Key;
use super::strings::keys as label;
use super::views::ViewId;

/// What a key asks for. Views interpret the moving and verb actions in their own way.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Action {
    Quit,
    Interrupt,
    Help,
    NextView,
    PrevView,
    AddNote,
    Up,
    Down,
    Left,
    Right,
    PageUp,
    PageDown,
    Home,
    End,
    Activate,
    Type(char),
    Save,
    /// Go on without what is asked (a guided check's step).
    Skip,
    AddRow,
    RemoveRow,
    /// To the speed or the dial column of the same row.
    ToSpeedColumn,
    ToDialColumn,
    NextModel,
    PrevModel,
    AutoModel,
    /// Show the API RP 13D field relations in place of the model (and back).
    ToggleRelations,
    /// Keep readings at or above full scale in the fit, or leave them out again.
    TogglePegged,
    Accept,
    AcceptNext,
    AcceptPrev,
    AcceptUp,
    AcceptDown,
    Cancel,
    DeleteBack,
    DeleteForward,
    ClearField,
    Close,
    Yes,
    No,
}

/// Where a binding applies.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Scope {
    /// Everywhere, even while typing or with an overlay open.
    Always,
    /// At the top level of every view.
    Global,
    /// Moving around, at the top level of every view.
    Moving,
    /// The active view's own bindings (its `keys()` table).
    View,
    /// The active view's own bindings that apply at its top level and also while one of its
    /// fields is being typed into (its `keys()` table too): Ctrl-S to save a form. Never a
    /// printable key (those go to the field), so only Ctrl and function keys.
    ViewTyping,
    /// While a field is being typed into (including the note box).
    Editing,
    /// The note box, before the editing keys.
    NoteBox,
    Help,
    ConfirmQuit,
}

/// What the screen is doing, which decides the scopes searched.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Context {
    Top(ViewId),
    Editing,
    /// Typing in the note box: the editing keys, but Enter saves and Tab goes nowhere.
    Note,
    Help,
    ConfirmQuit,
}

impl Context {
    /// Scopes to search, most specific first.
    pub fn scopes(self) -> Vec<Scope> {
        match self {
            Context::Top(_) => vec![
                Scope::View,
                Scope::ViewTyping,
                Scope::Moving,
                Scope::Global,
                Scope::Always,
            ],
            Context::Editing => vec![Scope::ViewTyping, Scope::Editing, Scope::Always],
            Context::Note => vec![Scope::NoteBox, Scope::Editing, Scope::Always],
            Context::Help => vec![Scope::Help, Scope::Always],
            Context::ConfirmQuit => vec![Scope::ConfirmQuit, Scope::Always],
        }
    }

    /// Scopes the footer lists: the note box names its own keys only.
    fn footer_scopes(self) -> Vec<Scope> {
        match self {
            Context::Note => vec![Scope::NoteBox, Scope::Always],
            other => other.scopes(),
        }
    }
}

/// One row of the map.
#[derive(Debug, Clone, Copy)]
pub struct Binding {
    pub scope: Scope,
    pub keys: &'static [Key],
    pub action: Action,
    pub label: &'static str,
    /// Shown in the footer (the help always shows every binding).
    pub footer: bool,
}

pub const fn b(scope: Scope, keys: &'static [Key], action: Action, label: &'static str) -> Binding {
    Binding {
        scope,
        keys,
        action,
        label,
        footer: true,
    }
}

/// Same as `b`, but only listed in the help.
pub const fn h(scope: Scope, keys: &'static [Key], action: Action, label: &'static str) -> Binding {
    Binding {
        footer: false,
        ..b(scope, keys, action, label)
    }
}

use Action as A;
use Key as K;
use Scope as S;

/// The shared bindings, in the order the help lists them.
pub const BINDINGS: &[Binding] = &[
    b(S::Always, &[K::Ctrl('c')], A::Interrupt, label::INTERRUPT),
    b(S::Global, &[K::Char('?')], A::Help, label::HELP),
    b(S::Global, &[K::Char('q')], A::Quit, label::QUIT),
    b(S::Global, &[K::Tab], A::NextView, label::NEXT_VIEW),
    h(S::Global, &[K::BackTab], A::PrevView, label::PREV_VIEW),
    b(S::Global, &[K::Char('n')], A::AddNote, label::ADD_NOTE),
    h(S::Moving, &[K::Up, K::Char('k')], A::Up, label::UP),
    h(S::Moving, &[K::Down, K::Char('j')], A::Down, label::DOWN),
    h(S::Moving, &[K::Left, K::Char('h')], A::Left, label::LEFT),
    h(S::Moving, &[K::Right, K::Char('l')], A::Right, label::RIGHT),
    h(S::Moving, &[K::PageUp], A::PageUp, label::PAGE_UP),
    h(S::Moving, &[K::PageDown], A::PageDown, label::PAGE_DOWN),
    h(S::Moving, &[K::Home, K::Char('g')], A::Home, label::HOME),
    h(S::Moving, &[K::End, K::Char('G')], A::End, label::END),
    b(S::Editing, &[K::Enter], A::Accept, label::ACCEPT),
    b(S::Editing, &[K::Tab], A::AcceptNext, label::ACCEPT_NEXT),
    h(S::Editing, &[K::BackTab], A::AcceptPrev, label::ACCEPT_PREV),
    h(S::Editing, &[K::Up], A::AcceptUp, label::ACCEPT_UP),
    h(S::Editing, &[K::Down], A::AcceptDown, label::ACCEPT_DOWN),
    b(S::Editing, &[K::Esc], A::Cancel, label::CANCEL_EDIT),
    h(
        S::Editing,
        &[K::Backspace],
        A::DeleteBack,
        label::DELETE_BACK,
    ),
    h(
        S::Editing,
        &[K::Delete],
        A::DeleteForward,
        label::DELETE_FORWARD,
    ),
    h(S::Editing, &[K::Left], A::Left, label::CURSOR_LEFT),
    h(S::Editing, &[K::Right], A::Right, label::CURSOR_RIGHT),
    h(
        S::Editing,
        &[K::Home, K::Ctrl('a')],
        A::Home,
        label::CURSOR_HOME,
    ),
    h(
        S::Editing,
        &[K::End, K::Ctrl('e')],
        A::End,
        label::CURSOR_END,
    ),
    h(
        S::Editing,
        &[K::Ctrl('u')],
        A::ClearField,
        label::CLEAR_FIELD,
    ),
    b(S::NoteBox, &[K::Enter], A::Accept, label::SAVE_NOTE),
    b(S::NoteBox, &[K::Esc], A::Cancel, label::CANCEL_NOTE),
    b(
        S::Help,
        &[K::Char('?'), K::Char('q'), K::Enter, K::Esc],
        A::Close,
        label::CLOSE,
    ),
    h(S::Help, &[K::Up, K::Char('k')], A::Up, label::UP),
    h(S::Help, &[K::Down, K::Char('j')], A::Down, label::DOWN),
    h(S::Help, &[K::PageUp], A::PageUp, label::PAGE_UP),
    h(
        S::Help,
        &[K::PageDown, K::Char(' ')],
        A::PageDown,
        label::PAGE_DOWN,
    ),
    b(
        S::ConfirmQuit,
        &[K::Char('y'), K::Ctrl('c')],
        A::Yes,
        label::YES_QUIT,
    ),
    b(
        S::ConfirmQuit,
        &[K::Char('n'), K::Esc],
        A::No,
        label::NO_STAY,
    ),
];

/// The action a pressed key stands for in this context. While typing, a printable
/// character with no binding is text for the field.
pub fn lookup(ctx: Context, key: Key, view_keys: &'static [Binding]) -> Option<Action> {
    for scope in ctx.scopes() {
        let hit = table(scope, view_keys)
            .filter(|b| b.scope == scope)
            .find_map(|b| b.keys.iter().find(|k| k.matches(key)).map(|k| (b, *k)));
        if let Some((binding, matched)) = hit {
            return Some(match (matched, key) {
                (Key::Digit, Key::Char(c)) => Action::Type(c),
                _ => binding.action,
            });
        }
    }
    match (ctx, key) {
        (Context::Editing | Context::Note, Key::Char(c)) => Some(Action::Type(c)),
        _ => None,
    }
}

/// The bindings that apply in a context, most specific first. A binding is left out when
/// an earlier one has the same action, or already takes all of its keys (Ctrl-C in the quit
/// question means "yes", so the everywhere-binding of Ctrl-C is not listed there).
pub fn bindings_for(ctx: Context, view_keys: &'static [Binding]) -> Vec<&'static Binding> {
    in_scopes(&ctx.scopes(), view_keys)
}

/// Where a scope's bindings are listed: the view's own table, or the shared one.
fn table(scope: Scope, view_keys: &'static [Binding]) -> impl Iterator<Item = &'static Binding> {
    let rows = if matches!(scope, Scope::View | Scope::ViewTyping) {
        view_keys
    } else {
        BINDINGS
    };
    rows.iter()
}

fn in_scopes(scopes: &[Scope], view_keys: &'static [Binding]) -> Vec<&'static Binding> {
    let mut out: Vec<&'static Binding> = Vec::new();
    for &scope in scopes {
        for binding in table(scope, view_keys).filter(|b| b.scope == scope) {
            let same_action = out.iter().any(|o| o.action == binding.action);
            let shadowed = binding
                .keys
                .iter()
                .all(|k| out.iter().any(|o| o.keys.contains(k)));
            if !same_action && !shadowed {
                out.push(binding);
            }
        }
    }
    out
}

/// Footer items for a context: ("key", "what it does"), in the map's order.
pub fn footer(ctx: Context, view_keys: &'static [Binding]) -> Vec<(String, &'static str)> {
    in_scopes(&ctx.footer_scopes(), view_keys)
        .into_iter()
        .filter(|b| b.footer)
        .map(|b| (key_names(b.keys), b.label))
        .collect()
}

/// All key names of a binding, as the help shows them ("Up / k").
pub fn key_names(keys: &[Key]) -> String {
    keys.iter()
        .map(|k| k.name())
        .collect::<Vec<_>>()
        .join(" / ")
}

/// Every binding of one scope, for a section of the help.
pub fn in_scope(scope: Scope) -> impl Iterator<Item = &'static Binding> {
    BINDINGS.iter().filter(move |b| b.scope == scope)
}
