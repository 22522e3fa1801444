namespace QaService.Core; public static class Placeholder {}
